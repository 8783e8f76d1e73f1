/**
 * Mistakes that make a comparison meaningless, refused before any verdict (exit 2 in the CLI,
 * blocked in the workbench):
 *
 * - the same file for both days (equal SHA-256 of the raw bytes, when the shell gives them);
 * - the same breath series for both days: at least half of one day's averaged points found,
 *   exactly, among the other day's, a point being its VO2, VCO2 and VE together (two real tests
 *   never share averaged points; a copy of one file under another name, or with edited
 *   metadata, does). The three values are matched jointly: matched one variable at a time,
 *   whole-number VO2 values of two different long tests (a million breaths) coincide by chance
 *   in over half the points;
 * - day 2 starting before (or at the same time as) day 1, unless the user confirms the order
 *   (`allowOrder`: the CLI's --allow-order, the workbench's swap or confirm);
 * - a file's own `# day:` metadata contradicting the slot it was loaded into.
 */
import type { TestAnalysis } from '../model/analysis';
import { startMs } from './pairing';

export type RefusalCode = 'same-file' | 'same-series' | 'day-order' | 'day-metadata';

export interface PairRefusal {
  readonly code: RefusalCode;
  readonly message: string;
}

export interface RefusalInputs {
  /** SHA-256 (hex) of each day's raw file, when known. */
  readonly day1Sha256?: string | null;
  readonly day2Sha256?: string | null;
  /** The user confirmed that day 2 may start before day 1. */
  readonly allowOrder?: boolean;
}

const SAME_SHARE = 0.5;

type Series = TestAnalysis['series'];

/**
 * Same value as the text of a number compares: NaN equals NaN, and −0 equals 0 (the test
 * once compared `${vo2}|${vco2}|${ve}` keys; this keeps its meaning without a million strings).
 */
function sameNumber(x: number, y: number): boolean {
  return x === y || (x !== x && y !== y);
}

const bits = new Float64Array(1);
const words = new Int32Array(bits.buffer);

/** A 32-bit hash of a number's bits, with −0 read as 0 and every NaN as one NaN. */
function numberHash(x: number, h: number): number {
  bits[0] = x === 0 ? 0 : x !== x ? Number.NaN : x;
  h = Math.imul(h ^ words[0], 0x9e3779b1);
  h = Math.imul(h ^ words[1], 0x85ebca77);
  return h ^ (h >>> 15);
}

function pointHash(s: Series, i: number): number {
  return numberHash(s.veLMin[i], numberHash(s.vco2MlMin[i], numberHash(s.vo2MlMin[i], 0x2f0f)));
}

/**
 * Whether at least half the points (VO2, VCO2 and VE together) of one series occur exactly in
 * the other: an open-addressing table of day 1's point indices, so a million-point pair costs
 * a few megabytes of integers rather than a set of strings.
 */
function sameSeries(a: Series, b: Series): boolean {
  const na = a.vo2MlMin.length;
  const nb = b.vo2MlMin.length;
  if (na === 0 || nb === 0) return false;
  let size = 1;
  while (size < 2 * na) size *= 2;
  const mask = size - 1;
  const slots = new Int32Array(size).fill(-1);
  const same = (s: Series, i: number, t: Series, j: number) =>
    sameNumber(s.vo2MlMin[i], t.vo2MlMin[j]) && sameNumber(s.vco2MlMin[i], t.vco2MlMin[j]) && sameNumber(s.veLMin[i], t.veLMin[j]);
  for (let i = 0; i < na; i++) {
    let k = pointHash(a, i) & mask;
    while (slots[k] >= 0 && !same(a, slots[k], a, i)) k = (k + 1) & mask;
    if (slots[k] < 0) slots[k] = i;
  }
  let equal = 0;
  for (let j = 0; j < nb; j++) {
    let k = pointHash(b, j) & mask;
    while (slots[k] >= 0 && !same(a, slots[k], b, j)) k = (k + 1) & mask;
    if (slots[k] >= 0) equal++;
  }
  return equal >= SAME_SHARE * Math.max(na, nb);
}

function statedDay(test: TestAnalysis): string | null {
  const extra = test.metadata.extra;
  const key = Object.keys(extra).find((k) => k.trim().toLowerCase() === 'day');
  return key === undefined ? null : extra[key].trim();
}

export function pairRefusals(day1: TestAnalysis, day2: TestAnalysis, inputs: RefusalInputs = {}): PairRefusal[] {
  const out: PairRefusal[] = [];
  const n1 = day1.sourceName;
  const n2 = day2.sourceName;
  if (inputs.day1Sha256 && inputs.day2Sha256 && inputs.day1Sha256 === inputs.day2Sha256) {
    out.push({ code: 'same-file', message: `The same file was given for both days: ${n1} and ${n2} have the same SHA-256 (${inputs.day1Sha256.slice(0, 16)}…). Load day 1 and day 2 from their own files.` });
  } else if (sameSeries(day1.series, day2.series)) {
    out.push({ code: 'same-series', message: `${n1} and ${n2} hold the same breath series (their averaged VO2, VCO2 and VE values are identical): one test was loaded for both days.` });
  }
  for (const [slot, test] of [[1, day1], [2, day2]] as const) {
    const stated = statedDay(test);
    if (stated !== null && /^\d+$/.test(stated) && Number(stated) !== slot) {
      out.push({ code: 'day-metadata', message: `${test.sourceName} states "day: ${stated}" in its metadata but was loaded as day ${slot}. Load it in the day-${stated} slot.` });
    }
  }
  const t1 = startMs(day1.metadata.testStart);
  const t2 = startMs(day2.metadata.testStart);
  if (!inputs.allowOrder && Number.isFinite(t1) && Number.isFinite(t2) && t2 <= t1) {
    out.push({
      code: 'day-order',
      message: `Day 2 (${n2}, ${day2.metadata.testStart}) starts ${((t1 - t2) / 3_600_000).toFixed(1)} h before day 1 (${n1}, ${day1.metadata.testStart}). Swap the files, or confirm this order (--allow-order).`,
    });
  }
  return out;
}
