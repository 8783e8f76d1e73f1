/**
 * The demo scenario: an invented lab and three invented patients, each tested twice about
 * 24 h apart. Nothing here describes a real organisation or person.
 *
 * Quillmoor Hill Exercise Laboratory, in the fictional town of Ambersett, at 180 m
 * (barometric pressure 745 mmHg). Patient codes QH-0417, QH-0522 and QH-0638.
 *
 *  - QH-0417, cycle ramp 15 W/min: day 2 reaches VT1 earlier, at a VO2 about 24 % lower
 *    (1300 → 985 mL/min) and the peak about 15 % lower (2250 → 1920 mL/min), near the
 *    published mean two-day declines (Keller et al., J Transl Med 2014: VO2 at VT −15.8 %,
 *    peak VO2 −13.8 %). The VO2–work relation is the same on both days (ΔVO2/ΔWR 10
 *    mL/min/W), so the workload at VT1 falls further than VO2; VO2 kinetics a little slower
 *    on day 2 (τ 50 s against 40 s); no VO2 plateau on day 2. Both days maximal (peak RER ≥
 *    1.10, RPE ≥ 17).
 *  - QH-0522, cycle ramp 20 W/min: day 2 reproduces day 1 within a few per cent.
 *  - QH-0638, treadmill walk with speed-and-grade steps: day 2 declines (VT1 VO2 down about
 *    24 %, peak VO2 down about 14 %).
 */
import { defaultCycleParams, defaultTreadmillParams, type TestParams } from '../generator/params';

export const LAB_NAME = 'Quillmoor Hill Exercise Laboratory, Ambersett';
const LAB_BAROMETRIC_MMHG = 745;

export interface DemoTest {
  /** File stem under sample-tests/demo/. */
  readonly name: string;
  readonly params: TestParams;
  readonly seed: number;
}

export interface DemoPair {
  readonly id: string;
  readonly outcome: 'decline' | 'reproduces';
  readonly summary: string;
  readonly day1: DemoTest;
  readonly day2: DemoTest;
}

function labMetadata(day: 1 | 2, operator: string): Readonly<Record<string, string>> {
  return { lab: LAB_NAME, day: String(day), operator };
}

const cycleBase = defaultCycleParams();
const treadmillBase = defaultTreadmillParams();

const qh0417 = { subjectId: 'QH-0417', ageY: 38, sex: 'F', heightCm: 167, weightKg: 70 } as const;
const qh0417Protocol = { kind: 'cycle-ramp', restS: 180, warmupS: 180, warmupW: 0, rampWPerMin: 15, recoveryS: 180, recoveryW: 0 } as const;

const qh0522 = { subjectId: 'QH-0522', ageY: 52, sex: 'M', heightCm: 178, weightKg: 84 } as const;
const qh0522Protocol = { kind: 'cycle-ramp', restS: 150, warmupS: 180, warmupW: 20, rampWPerMin: 20, recoveryS: 150, recoveryW: 20 } as const;

const qh0638 = { subjectId: 'QH-0638', ageY: 29, sex: 'F', heightCm: 162, weightKg: 58 } as const;

export const DEMO_PAIRS: readonly DemoPair[] = [
  {
    id: 'qh0417',
    outcome: 'decline',
    summary: 'cycle ramp; day 2 reaches VT1 earlier (VO2 about 24 % lower) and peaks about 15 % lower',
    day1: {
      name: 'qh0417-day1',
      seed: 41701,
      params: {
        ...cycleBase,
        name: 'qh0417-day1',
        subject: qh0417,
        protocol: qh0417Protocol,
        protocolLabel: 'cycle ramp 15 W/min after 3 min unloaded',
        testStart: '2026-03-09T09:10:00+01:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 40,
        cycleGainMlMinW: 10,
        vo2PeakMlMin: 2250,
        plateauS: 60,
        vt1Vo2MlMin: 1300,
        vt2Vo2MlMin: 1850,
        hrRestBpm: 74,
        hrPeakFractionOfPredicted: 0.96,
        outlierBreaths: 3,
        rpe: { peakBorg: 18, intervalS: 120 },
        extraMetadata: labMetadata(1, 'staff 03'),
      },
    },
    day2: {
      name: 'qh0417-day2',
      seed: 41702,
      params: {
        ...cycleBase,
        name: 'qh0417-day2',
        subject: qh0417,
        protocol: qh0417Protocol,
        protocolLabel: 'cycle ramp 15 W/min after 3 min unloaded',
        testStart: '2026-03-10T09:25:00+01:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 50,
        cycleGainMlMinW: 10,
        vo2PeakMlMin: 1920,
        plateauS: 0,
        vt1Vo2MlMin: 985,
        vt2Vo2MlMin: 1630,
        hrRestBpm: 80,
        hrPeakFractionOfPredicted: 0.93,
        outlierBreaths: 3,
        rpe: { peakBorg: 19, intervalS: 120 },
        extraMetadata: labMetadata(2, 'staff 03'),
      },
    },
  },
  {
    id: 'qh0522',
    outcome: 'reproduces',
    summary: 'cycle ramp; day 2 within a few per cent of day 1',
    day1: {
      name: 'qh0522-day1',
      seed: 52201,
      params: {
        ...cycleBase,
        name: 'qh0522-day1',
        subject: qh0522,
        protocol: qh0522Protocol,
        protocolLabel: 'cycle ramp 20 W/min after 3 min at 20 W',
        testStart: '2026-04-14T14:00:00+02:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 45,
        vo2PeakMlMin: 2350,
        plateauS: 30,
        vt1Vo2MlMin: 1300,
        vt2Vo2MlMin: 1950,
        hrRestBpm: 68,
        hrPeakFractionOfPredicted: 0.97,
        outlierBreaths: 2,
        rpe: { peakBorg: 18, intervalS: 120 },
        extraMetadata: labMetadata(1, 'staff 07'),
      },
    },
    day2: {
      name: 'qh0522-day2',
      seed: 52202,
      params: {
        ...cycleBase,
        name: 'qh0522-day2',
        subject: qh0522,
        protocol: qh0522Protocol,
        protocolLabel: 'cycle ramp 20 W/min after 3 min at 20 W',
        testStart: '2026-04-15T13:50:00+02:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 44,
        vo2PeakMlMin: 2400,
        plateauS: 30,
        vt1Vo2MlMin: 1340,
        vt2Vo2MlMin: 1990,
        hrRestBpm: 67,
        hrPeakFractionOfPredicted: 0.97,
        outlierBreaths: 2,
        rpe: { peakBorg: 18, intervalS: 120 },
        extraMetadata: labMetadata(2, 'staff 07'),
      },
    },
  },
  {
    id: 'qh0638',
    outcome: 'decline',
    summary: 'treadmill walk; day 2 reaches VT1 at a lower VO2 (about 24 %) and an earlier speed-grade stage',
    day1: {
      name: 'qh0638-day1',
      seed: 63801,
      params: {
        ...treadmillBase,
        name: 'qh0638-day1',
        subject: qh0638,
        testStart: '2026-05-20T10:30:00+02:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 40,
        vo2PeakMlMin: 1900,
        plateauS: 40,
        vt1Vo2MlMin: 1050,
        vt2Vo2MlMin: 1560,
        hrRestBpm: 70,
        hrPeakFractionOfPredicted: 0.96,
        outlierBreaths: 2,
        rpe: { peakBorg: 18, intervalS: 120 },
        extraMetadata: labMetadata(1, 'staff 11'),
      },
    },
    day2: {
      name: 'qh0638-day2',
      seed: 63802,
      params: {
        ...treadmillBase,
        name: 'qh0638-day2',
        subject: qh0638,
        testStart: '2026-05-21T10:40:00+02:00',
        barometricMmhg: LAB_BAROMETRIC_MMHG,
        vo2TauS: 45,
        vo2PeakMlMin: 1625,
        plateauS: 0,
        vt1Vo2MlMin: 800,
        vt2Vo2MlMin: 1370,
        hrRestBpm: 78,
        hrPeakFractionOfPredicted: 0.93,
        outlierBreaths: 2,
        rpe: { peakBorg: 19, intervalS: 120 },
        extraMetadata: labMetadata(2, 'staff 11'),
      },
    },
  },
];
