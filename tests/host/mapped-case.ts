/**
 * A case whose day-1 export needed a column map: the demo day-1 file with its heart-rate
 * header renamed to a word the importer does not know, and the map that names it again.
 * Renaming a header and naming it back in a map changes no value, so the original file read
 * by detection alone is the reference for every number.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import type { CaseFile } from '../../core/case/case-file';
import { newCase } from '../../core/case/new-case';
import type { ColumnMapping } from '../../core/import/mapping';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';

export const original = new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1)));
export const renamed = new TextEncoder().encode(new TextDecoder().decode(original).replace('hr_bpm', 'cardiac_beats'));
export const day2 = new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day2)));
export const heartRateMap: ColumnMapping = { format: 'twofold-column-map', version: 1, columns: [{ header: 'cardiac_beats', variable: 'hrBpm', unit: 'bpm' }] };

const at = '2026-03-11T10:00:00Z';
const clinical = { day1: noClinicalInputs(), day2: noClinicalInputs() };

/** The case of the renamed day 1 (same file name as the original) and the demo day 2. */
export function mappedCase(columnMap: ColumnMapping | null): CaseFile {
  return newCase(at, { name: DEMO_PAIR.day1, bytes: renamed, columnMap }, { name: DEMO_PAIR.day2, bytes: day2 }, DEFAULT_SETTINGS, clinical);
}

/** The reference: the original pair, read by detection alone. */
export function originalCase(): CaseFile {
  return newCase(at, { name: DEMO_PAIR.day1, bytes: original }, { name: DEMO_PAIR.day2, bytes: day2 }, DEFAULT_SETTINGS, clinical);
}
