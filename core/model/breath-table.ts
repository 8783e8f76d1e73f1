/**
 * The breath table: one cardiopulmonary exercise test in canonical units.
 *
 * Canonical units (converted once, at import): time s, VO2 and VCO2 mL/min (STPD),
 * VE L/min (BTPS), HR bpm, work W, treadmill speed km/h and grade %, PetO2 and
 * PetCO2 mmHg, breathing rate breaths/min, tidal volume L.
 * A quantity the cart did not record is `null`, never 0.
 */

export type Modality = 'cycle' | 'treadmill';
export type Sex = 'F' | 'M';

/** Every variable a breath row can carry, by its canonical key. */
export const BREATH_VARIABLES = [
  'timeS',
  'vo2MlMin',
  'vco2MlMin',
  'veLMin',
  'hrBpm',
  'workW',
  'speedKmh',
  'gradePct',
  'peto2Mmhg',
  'petco2Mmhg',
  'rrPerMin',
  'vtL',
] as const;
export type BreathVariable = (typeof BREATH_VARIABLES)[number];

/** Variables every usable test must have. */
export const REQUIRED_VARIABLES: readonly BreathVariable[] = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin'];

export interface Breath {
  /** Time since the start of the recording, s. */
  readonly timeS: number;
  readonly vo2MlMin: number;
  readonly vco2MlMin: number;
  readonly veLMin: number;
  readonly hrBpm: number | null;
  readonly workW: number | null;
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
  readonly peto2Mmhg: number | null;
  readonly petco2Mmhg: number | null;
  readonly rrPerMin: number | null;
  readonly vtL: number | null;
  /** 1-based line of the source file this breath came from (0 when generated in memory). */
  readonly sourceLine: number;
}

/** A Borg 6–20 rating of perceived exertion, taken at a time during the test. */
export interface RpeReading {
  readonly timeS: number;
  readonly borg: number;
}

export interface TestMetadata {
  readonly subjectId: string | null;
  readonly ageY: number | null;
  readonly sex: Sex | null;
  readonly heightCm: number | null;
  readonly weightKg: number | null;
  /** ISO 8601 date-time of the start of the recording. */
  readonly testStart: string | null;
  readonly modality: Modality | null;
  readonly protocol: string | null;
  readonly barometricMmhg: number | null;
  /** Any further `key: value` pairs found above the table, kept verbatim. */
  readonly extra: Readonly<Record<string, string>>;
}

export interface BreathTable {
  readonly metadata: TestMetadata;
  readonly breaths: readonly Breath[];
  readonly rpe: readonly RpeReading[];
  /** Name of the file the table was read from, as the user gave it. */
  readonly sourceName: string;
}

export function emptyMetadata(): TestMetadata {
  return {
    subjectId: null,
    ageY: null,
    sex: null,
    heightCm: null,
    weightKg: null,
    testStart: null,
    modality: null,
    protocol: null,
    barometricMmhg: null,
    extra: {},
  };
}

/** A breath with every optional variable absent; handy for building tables in code. */
export function breath(fields: Pick<Breath, 'timeS' | 'vo2MlMin' | 'vco2MlMin' | 'veLMin'> & Partial<Breath>): Breath {
  return {
    hrBpm: null,
    workW: null,
    speedKmh: null,
    gradePct: null,
    peto2Mmhg: null,
    petco2Mmhg: null,
    rrPerMin: null,
    vtL: null,
    sourceLine: 0,
    ...fields,
  };
}
