/**
 * `--day1-map FILE` / `--day2-map FILE`: the column map (docs/formats.md, `twofold-column-map`)
 * a breath file is read with, for an export whose columns the importer cannot name by itself.
 * A new case records the maps given; a reopened case keeps the maps it recorded, and a map
 * that differs from the recorded one is refused (the case's numbers and reviewer log were made
 * on the files as they were read: a different reading is a different case).
 */
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { columnMapOf, type CaseFile, type DayNumber } from '../core/case/case-file';
import { canonicalJson } from '../core/case/canonical-json';
import { parseMapping, type ColumnMapping } from '../core/import/mapping';
import { formatLocated } from '../core/model/errors';
import { readProblem } from '../host/read-problem';

export type GivenMaps = Readonly<Record<DayNumber, ColumnMapping | null>>;

/** The maps named by the flags, or a message naming the file and the place that is wrong. */
export function readMapFlags(values: Readonly<Record<string, unknown>>, cwd: string): { ok: true; maps: GivenMaps } | { ok: false; message: string } {
  const maps: Record<DayNumber, ColumnMapping | null> = { 1: null, 2: null };
  for (const day of [1, 2] as const) {
    const flag = values[`day${day}-map`];
    if (typeof flag !== 'string') continue;
    const path = resolve(cwd, flag);
    if (!existsSync(path)) return { ok: false, message: `${path}:0:0: The column map file given with --day${day}-map does not exist.` };
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch (error) {
      return { ok: false, message: `${path}:0:0: ${readProblem(error, `column map file given with --day${day}-map`)}` };
    }
    const parsed = parseMapping(text, path);
    if (!parsed.ok) return { ok: false, message: formatLocated(parsed.error) };
    maps[day] = parsed.value;
  }
  return { ok: true, maps };
}

/** The days whose given map differs from the one the case recorded (a day without a flag keeps its map). */
export function differingMaps(caseFile: CaseFile, given: GivenMaps): DayNumber[] {
  const same = (a: ColumnMapping | null, b: ColumnMapping | null) => {
    const ta = canonicalJson(a);
    const tb = canonicalJson(b);
    return ta.ok && tb.ok && ta.value === tb.value;
  };
  return ([1, 2] as const).filter((day) => {
    const map = given[day];
    const recorded = columnMapOf(day === 1 ? caseFile.inputs.day1 : caseFile.inputs.day2);
    return map !== null && !same(map, recorded);
  });
}
