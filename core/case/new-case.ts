/**
 * A new case from two raw breath files: each is named by its SHA-256 and stored in the case
 * folder as raw/<sha256>.<extension>, so the folder is self-contained and a copy can never be
 * confused with another file of the same name.
 *
 * Example: a file "day1.csv" whose SHA-256 is ab12… is stored as "raw/ab12….csv".
 */
import type { ClinicalInputs } from '../model/analysis';
import type { Settings } from '../model/settings';
import { CASE_FORMAT, CASE_VERSION, type CaseFile, type RawInput } from './case-file';
import { sha256Hex } from './sha256';

export interface RawFile {
  readonly name: string;
  readonly bytes: Uint8Array;
}

export function rawInput(file: RawFile): RawInput {
  const sha256 = sha256Hex(file.bytes);
  const ext = /\.([A-Za-z0-9]{1,8})$/.exec(file.name)?.[1].toLowerCase();
  return { name: file.name, sha256, sizeBytes: file.bytes.length, storedAs: `raw/${sha256}${ext ? `.${ext}` : ''}` };
}

export function newCase(createdAt: string, day1: RawFile, day2: RawFile, settings: Settings, clinical: { day1: ClinicalInputs; day2: ClinicalInputs }): CaseFile {
  return {
    format: CASE_FORMAT,
    version: CASE_VERSION,
    createdAt,
    inputs: { day1: rawInput(day1), day2: rawInput(day2) },
    settings,
    clinical,
    log: [],
    recorded: null,
  };
}
