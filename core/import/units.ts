/**
 * Units as carts write them, and the factor to Twofold's canonical unit
 * (core/model/breath-table.ts): VO2/VCO2 mL/min, VE L/min, PetO2/PetCO2 mmHg, speed km/h,
 * tidal volume L, time s.
 *
 * Conversion factors: 1 L = 1000 mL (definition); 1 kPa = 760/101.325 = 7.50062 mmHg
 * (standard atmosphere, 760 mmHg = 101.325 kPa); 1 mile = 1.609344 km (international mile);
 * 1 m/s = 3.6 km/h.
 *
 * A missing unit is inferred from the magnitude of the values (`inferUnit`): gas flows
 * below 10 are L/min (no adult breathes out 10 mL/min of CO2), VE above 500 is mL/min,
 * end-tidal pressures below 25 are kPa (normal PetCO2 is about 35–45 mmHg, 4.7–6 kPa),
 * tidal volume above 20 is mL (common practice; thresholds chosen with a wide margin).
 */
import type { ColumnVariable } from './types';

export const MMHG_PER_KPA = 760 / 101.325;
export const KMH_PER_MPH = 1.609344;

export interface UnitSpec {
  /** The unit as Twofold writes it, e.g. `L/min`. */
  readonly label: string;
  /** Multiply a value in this unit by `factor` to get the canonical unit. */
  readonly factor: number;
  /** Time written as `mm:ss` or `h:mm:ss` (factor 1, parsed by time-format.ts). */
  readonly colon?: boolean;
  /** VO2 given per kg of body weight (mL/kg/min): the column feeds `vo2MlKgMin`. */
  readonly perKg?: boolean;
}

/** Lower case, no spaces, `·`/`*` and `-1` exponents written as `/`, no STPD/BTPS qualifier. */
export function normalizeUnit(unit: string): string {
  return unit
    .toLowerCase()
    .replace(/\b(stpd|btps|atps)\b/g, '')
    .replace(/\s+/g, '')
    .replace(/[·*⋅]/g, '/')
    .replace(/\^?(-1|⁻¹)/g, '')
    .replace(/\/+/g, '/')
    .replace(/(.)\/$/, '$1')
    .replace(/µ/g, 'u');
}

const GAS: Record<string, UnitSpec> = {
  'ml/min': { label: 'mL/min', factor: 1 },
  'l/min': { label: 'L/min', factor: 1000 },
  'ml/kg/min': { label: 'mL/kg/min', factor: 1, perKg: true },
  'ml/min/kg': { label: 'mL/kg/min', factor: 1, perKg: true },
};
const VENT: Record<string, UnitSpec> = {
  'l/min': { label: 'L/min', factor: 1 },
  'ml/min': { label: 'mL/min', factor: 0.001 },
};
const PER_MIN: Record<string, UnitSpec> = {
  '/min': { label: '/min', factor: 1 },
  '1/min': { label: '/min', factor: 1 },
  min: { label: '/min', factor: 1 },
  bpm: { label: '/min', factor: 1 },
  'b/min': { label: '/min', factor: 1 },
  'beats/min': { label: '/min', factor: 1 },
  'br/min': { label: '/min', factor: 1 },
  'breaths/min': { label: '/min', factor: 1 },
};
const PRESSURE: Record<string, UnitSpec> = {
  mmhg: { label: 'mmHg', factor: 1 },
  torr: { label: 'mmHg', factor: 1 },
  kpa: { label: 'kPa', factor: MMHG_PER_KPA },
};

const UNITS: Readonly<Record<ColumnVariable, Record<string, UnitSpec>>> = {
  timeS: {
    s: { label: 's', factor: 1 },
    sec: { label: 's', factor: 1 },
    secs: { label: 's', factor: 1 },
    seconds: { label: 's', factor: 1 },
    min: { label: 'min', factor: 60 },
    'mm:ss': { label: 'mm:ss', factor: 1, colon: true },
    'm:ss': { label: 'mm:ss', factor: 1, colon: true },
    'min:s': { label: 'mm:ss', factor: 1, colon: true },
    'min:sec': { label: 'mm:ss', factor: 1, colon: true },
    'hh:mm:ss': { label: 'h:mm:ss', factor: 1, colon: true },
    'h:mm:ss': { label: 'h:mm:ss', factor: 1, colon: true },
    'h:m:s': { label: 'h:mm:ss', factor: 1, colon: true },
    clock: { label: 'clock', factor: 1, colon: true },
    'date-time': { label: 'date-time', factor: 1, colon: true },
  },
  vo2MlMin: GAS,
  vco2MlMin: GAS,
  vo2MlKgMin: { 'ml/kg/min': GAS['ml/kg/min'], 'ml/min/kg': GAS['ml/min/kg'] },
  veLMin: VENT,
  hrBpm: Object.fromEntries(Object.entries(PER_MIN).map(([k, u]) => [k, { ...u, label: 'bpm' }])),
  rrPerMin: PER_MIN,
  workW: { w: { label: 'W', factor: 1 }, watt: { label: 'W', factor: 1 }, watts: { label: 'W', factor: 1 } },
  speedKmh: {
    'km/h': { label: 'km/h', factor: 1 },
    kmh: { label: 'km/h', factor: 1 },
    kph: { label: 'km/h', factor: 1 },
    mph: { label: 'mph', factor: KMH_PER_MPH },
    'm/s': { label: 'm/s', factor: 3.6 },
  },
  gradePct: { '%': { label: '%', factor: 1 }, pct: { label: '%', factor: 1 }, percent: { label: '%', factor: 1 } },
  peto2Mmhg: PRESSURE,
  petco2Mmhg: PRESSURE,
  vtL: { l: { label: 'L', factor: 1 }, ml: { label: 'mL', factor: 0.001 } },
  rer: { '': { label: '', factor: 1 }, '-': { label: '', factor: 1 } },
  rpe: { '': { label: '', factor: 1 }, '-': { label: '', factor: 1 }, borg: { label: '', factor: 1 }, '6-20': { label: '', factor: 1 } },
};

/** The unit a cart wrote for a variable, or null when Twofold does not know it for that variable. */
export function parseUnit(variable: ColumnVariable, unit: string): UnitSpec | null {
  // RER and Borg RPE have no unit; whatever a cart writes beside them changes nothing.
  if (variable === 'rer' || variable === 'rpe') return { label: '', factor: 1 };
  const key = normalizeUnit(unit);
  const table = UNITS[variable];
  return table[key] ?? null;
}

/** The unit every value of the variable takes when the file names none. */
export function onlyUnit(variable: ColumnVariable): UnitSpec | null {
  switch (variable) {
    case 'hrBpm':
      return { label: 'bpm', factor: 1 };
    case 'rrPerMin':
      return { label: '/min', factor: 1 };
    case 'workW':
      return { label: 'W', factor: 1 };
    case 'gradePct':
      return { label: '%', factor: 1 };
    case 'vo2MlKgMin':
      return { label: 'mL/kg/min', factor: 1, perKg: true };
    case 'rer':
    case 'rpe':
      return { label: '', factor: 1 };
    default:
      return null;
  }
}

/**
 * The unit a column of unnamed unit most likely has, from the median of its values, with
 * the reason in words. Time is left to time-format.ts.
 */
export function inferUnit(variable: ColumnVariable, medianValue: number): { unit: UnitSpec; reason: string } | null {
  const m = Number.isFinite(medianValue) ? medianValue : 0;
  const shown = Number(m.toPrecision(3));
  switch (variable) {
    case 'vo2MlMin':
    case 'vco2MlMin':
      return m < 10
        ? { unit: GAS['l/min'], reason: `values around ${shown} can only be L/min` }
        : { unit: GAS['ml/min'], reason: `values around ${shown} can only be mL/min` };
    case 'veLMin':
      return m > 500
        ? { unit: VENT['ml/min'], reason: `values around ${shown} can only be mL/min` }
        : { unit: VENT['l/min'], reason: `values around ${shown} are read as L/min` };
    case 'peto2Mmhg':
    case 'petco2Mmhg':
      return m < 25
        ? { unit: PRESSURE.kpa, reason: `values around ${shown} can only be kPa` }
        : { unit: PRESSURE.mmhg, reason: `values around ${shown} are read as mmHg` };
    case 'vtL':
      return m > 20
        ? { unit: UNITS.vtL.ml, reason: `values around ${shown} can only be mL` }
        : { unit: UNITS.vtL.l, reason: `values around ${shown} are read as L` };
    case 'speedKmh':
      return { unit: UNITS.speedKmh['km/h'], reason: 'km/h and mph cannot be told apart by size; km/h assumed' };
    default:
      return null;
  }
}

export function knownUnitLabels(variable: ColumnVariable): string[] {
  return [...new Set(Object.values(UNITS[variable]).map((u) => u.label).filter((l) => l !== ''))];
}
