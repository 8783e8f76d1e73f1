/**
 * The default engine with each day's analysis remembered for the life of the process, keyed
 * by the raw file's SHA-256, its column map, the settings and the clinical inputs. A
 * reviewer action changes only what follows the analysis (values at the threshold, the
 * comparison), so recomputing after an override need not re-read and re-analyse the
 * breath files. Safe because
 * readTable and analyzeTest are pure and their results are never mutated.
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
  const tables = new Map<string, Result<BreathTable>>();
  const analyses = new WeakMap<BreathTable, Map<string, Result<TestAnalysis>>>();
  return {
    ...defaultEngine,
    readTable: (name, bytes, settings, columnMap) => {
      const key = canonicalJson({ name, sha: sha256Hex(bytes), settings, columnMap });
      if (!key.ok) return defaultEngine.readTable(name, bytes, settings, columnMap);
      const hit = tables.get(key.value);
      if (hit) return hit;
      const read = defaultEngine.readTable(name, bytes, settings, columnMap);
      if (tables.size >= LIMIT) tables.delete(tables.keys().next().value as string);
      tables.set(key.value, read);
      return read;
    },
    analyzeTest: (table, settings, clinical) => {
      const key = canonicalJson({ settings, clinical });
      if (!key.ok) return defaultEngine.analyzeTest(table, settings, clinical);
      const perTable = analyses.get(table) ?? new Map<string, Result<TestAnalysis>>();
      analyses.set(table, perTable);
      const hit = perTable.get(key.value);
      if (hit) return hit;
      const result = defaultEngine.analyzeTest(table, settings, clinical);
      perTable.set(key.value, result);
      return result;
    },
  };
}
