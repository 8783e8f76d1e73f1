/**
 * Breath files for the compare and band CLI tests, written to a temp dir from the test-data
 * generator (sample-tests/generator: a stated physiological model with known VT1). Day 2 of a
 * declining pair has its true VT1 VO2 scaled by `vt1Scale`; a reproducing pair only changes
 * the noise seed.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeBreathCsv } from '../../../core/export/breath-csv';
import { defaultCycleParams, generateTest } from '../../../sample-tests/generator/index';

export interface WrittenPair {
  readonly day1: string;
  readonly day2: string;
  readonly trueVt1Day1MlMin: number;
  readonly trueVt1Day2MlMin: number;
}

export function writePair(dir: string, name: string, seed: number, vt1Scale = 1, subjectId = name): WrittenPair {
  mkdirSync(dir, { recursive: true });
  const base = defaultCycleParams();
  const subject = { ...base.subject, subjectId };
  const d1 = generateTest({ ...base, subject, testStart: '2026-03-09T09:00:00Z' }, seed);
  const d2 = generateTest({ ...base, subject, testStart: '2026-03-10T09:30:00Z', vt1Vo2MlMin: base.vt1Vo2MlMin * vt1Scale }, seed + 7919);
  const day1 = join(dir, `${name}-day1.csv`);
  const day2 = join(dir, `${name}-day2.csv`);
  writeFileSync(day1, writeBreathCsv(d1.table));
  writeFileSync(day2, writeBreathCsv(d2.table));
  return { day1, day2, trueVt1Day1MlMin: base.vt1Vo2MlMin, trueVt1Day2MlMin: base.vt1Vo2MlMin * vt1Scale };
}

/** A capturing terminal for `main`. */
export function captureIo(cwd: string, interactive = false) {
  const out: string[] = [];
  const err: string[] = [];
  return {
    io: { out: (t: string) => void out.push(t), err: (t: string) => void err.push(t), env: {}, cwd, interactive },
    out: () => out.join(''),
    err: () => err.join(''),
  };
}
