/**
 * The default engine with each day's analysis remembered for the life of the process, keyed
 * by the raw file's name and SHA-256, its column map, the settings and the clinical inputs. A
 * reviewer action changes only what follows the analysis (values at the threshold, the
 * comparison), so recomputing after an override re-reads the breath file (milliseconds for
 * an ordinary test) but does not re-analyse it. Safe because readTable and analyzeTest are
 * pure and their results are never mutated.
 *
 * The breath tables themselves are not kept: a table holds an object per breath (about
 * 250 MB for a million breaths), while its analysis keeps only the averaged series.
 */
import { canonicalJson } from '../core/case/canonical-json';
import { defaultEngine } from '../core/case/default-engine';
import type { Engine } from '../core/case/engine';
import { sha256Hex } from '../core/case/sha256';
import type { Comparison } from '../core/compare/compare-tests';
import type { TestAnalysis } from '../core/model/analysis';
import type { BreathTable } from '../core/model/breath-table';
import type { Result } from '../core/model/errors';

const LIMIT = 16;

export function cachedEngine(): Engine<Comparison> {
  /** The key of the file each table was read from, while the table lives. */
  const tableKeys = new WeakMap<BreathTable, string>();
  const analyses = new Map<string, Result<TestAnalysis>>();
  return {
    ...defaultEngine,
    readTable: (name, bytes, settings, columnMap) => {
      const read = defaultEngine.readTable(name, bytes, settings, columnMap);
      const key = canonicalJson({ name, sha: sha256Hex(bytes), settings, columnMap });
      if (read.ok && key.ok) tableKeys.set(read.value, key.value);
      return read;
    },
    analyzeTest: (table, settings, clinical) => {
      const tableKey = tableKeys.get(table);
      const key = tableKey === undefined ? null : canonicalJson({ table: tableKey, settings, clinical });
      if (key === null || !key.ok) return defaultEngine.analyzeTest(table, settings, clinical);
      const hit = analyses.get(key.value);
      if (hit) return hit;
      const result = defaultEngine.analyzeTest(table, settings, clinical);
      if (analyses.size >= LIMIT) analyses.delete(analyses.keys().next().value as string);
      analyses.set(key.value, result);
      return result;
    },
  };
}
