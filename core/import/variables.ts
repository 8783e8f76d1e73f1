/**
 * Header names as carts write them, mapped to Twofold's variables. Matching ignores case,
 * spaces, apostrophes and dots (`V'O2`, `V.O2`, `vo2` are one name), a trailing STPD/BTPS
 * qualifier, and a unit in brackets or parentheses, which `splitHeader` returns apart.
 * The synonyms are the trade's own abbreviations (common practice).
 *
 * Example: splitHeader("V'O2 STPD [L/min]") → { name: "V'O2 STPD", unit: "L/min" };
 * matchVariable("V'O2 STPD") → 'vo2MlMin'.
 */
import type { ColumnVariable } from './types';

/** Our own plain layout: exact header names with the unit each implies (see docs/formats.md). */
export const PLAIN_LAYOUT_COLUMNS: Readonly<Record<string, { variable: ColumnVariable; unit: string | null }>> = {
  time_s: { variable: 'timeS', unit: 's' },
  vo2_ml_min: { variable: 'vo2MlMin', unit: 'mL/min' },
  vco2_ml_min: { variable: 'vco2MlMin', unit: 'mL/min' },
  ve_l_min: { variable: 'veLMin', unit: 'L/min' },
  hr_bpm: { variable: 'hrBpm', unit: 'bpm' },
  work_w: { variable: 'workW', unit: 'W' },
  speed_kmh: { variable: 'speedKmh', unit: 'km/h' },
  grade_pct: { variable: 'gradePct', unit: '%' },
  peto2_mmhg: { variable: 'peto2Mmhg', unit: 'mmHg' },
  petco2_mmhg: { variable: 'petco2Mmhg', unit: 'mmHg' },
  rr_per_min: { variable: 'rrPerMin', unit: '/min' },
  vt_l: { variable: 'vtL', unit: 'L' },
  rpe: { variable: 'rpe', unit: null },
};

const SYNONYMS: Readonly<Record<string, ColumnVariable>> = {
  t: 'timeS',
  time: 'timeS',
  elapsed: 'timeS',
  elapsedtime: 'timeS',
  testtime: 'timeS',
  clock: 'timeS',
  clocktime: 'timeS',
  timeofday: 'timeS',
  vo2: 'vo2MlMin',
  o2uptake: 'vo2MlMin',
  vco2: 'vco2MlMin',
  co2output: 'vco2MlMin',
  ve: 'veLMin',
  ventilation: 'veLMin',
  minuteventilation: 'veLMin',
  hr: 'hrBpm',
  heartrate: 'hrBpm',
  load: 'workW',
  power: 'workW',
  watts: 'workW',
  watt: 'workW',
  work: 'workW',
  workload: 'workW',
  workrate: 'workW',
  wr: 'workW',
  speed: 'speedKmh',
  grade: 'gradePct',
  incline: 'gradePct',
  peto2: 'peto2Mmhg',
  eto2: 'peto2Mmhg',
  endtidalo2: 'peto2Mmhg',
  endtidalco2: 'petco2Mmhg',
  petco2: 'petco2Mmhg',
  etco2: 'petco2Mmhg',
  bf: 'rrPerMin',
  rr: 'rrPerMin',
  fr: 'rrPerMin',
  rf: 'rrPerMin',
  breathingfrequency: 'rrPerMin',
  respiratoryrate: 'rrPerMin',
  resprate: 'rrPerMin',
  'breaths/min': 'rrPerMin',
  vt: 'vtL',
  vtex: 'vtL',
  tidalvolume: 'vtL',
  tidalvol: 'vtL',
  'vo2/kg': 'vo2MlKgMin',
  vo2kg: 'vo2MlKgMin',
  vo2perkg: 'vo2MlKgMin',
  relvo2: 'vo2MlKgMin',
  rer: 'rer',
  rq: 'rer',
  rpe: 'rpe',
  borg: 'rpe',
  borgrpe: 'rpe',
};

/** Header names that say the time column is a time of day, not time since the start. */
const CLOCK_NAMES = new Set(['clock', 'clocktime', 'timeofday']);

/** The name and the bracketed (or trailing `x/y`) unit of a header cell. */
export function splitHeader(raw: string): { name: string; unit: string | null } {
  const cell = raw.trim().replace(/^"(.*)"$/, '$1').trim();
  const bracket = /^(.*?)\s*[[(]([^\])]*)[\])]\s*(.*)$/.exec(cell);
  if (bracket) {
    const name = `${bracket[1]} ${bracket[3]}`.trim();
    const unit = bracket[2].trim();
    return { name, unit: unit === '' ? null : unit };
  }
  // `VO2 mL/min`, `VE l/min STPD`: a last word with a slash is a unit.
  const words = cell.split(/\s+/);
  if (words.length >= 2) {
    const idx = words.findIndex((w, i) => i > 0 && /\//.test(w));
    if (idx > 0) return { name: words.slice(0, idx).join(' '), unit: words.slice(idx).join(' ') };
  }
  return { name: cell, unit: null };
}

/** Lower case, without spaces, apostrophes, dots, underscores, dashes and a STPD/BTPS/ATPS qualifier. */
export function normalizeName(name: string): string {
  return name
    .toLowerCase()
    .replace(/[\s'’`´˙.·_\-]/g, '')
    .replace(/₂/g, '2')
    .replace(/(stpd|btps|atps)$/, '');
}

/** The variable a header name stands for, or null when Twofold does not use it. */
export function matchVariable(name: string): ColumnVariable | null {
  return SYNONYMS[normalizeName(name)] ?? null;
}

export function isClockName(name: string): boolean {
  return CLOCK_NAMES.has(normalizeName(name));
}

/** The variable and unit a header cell implies (our plain layout first, then the synonyms). */
export function readHeaderCell(raw: string): { variable: ColumnVariable | null; name: string; unit: string | null } {
  const trimmed = raw.trim();
  const plain = PLAIN_LAYOUT_COLUMNS[trimmed.toLowerCase()];
  if (plain) return { variable: plain.variable, name: trimmed, unit: plain.unit };
  const { name, unit } = splitHeader(trimmed);
  return { variable: matchVariable(name), name, unit };
}
