/**
 * The ceiling of the day-2 verdict: an oracle that knows each day's true values (the model's
 * VO2 and workload at VT1, peak VO2 and peak workload, from the generators' truth) and so has
 * no measurement error at all, only the biological day-to-day variation the pairs are drawn
 * with (day2-pairs.ts). It applies the same call as the comparison (change-interval.ts
 * `changeCall`, with both days' measurement SD 0) against the same band. No analysis runs, so
 * it is fast. What it cannot find, no detector can: with biology alone a −15.8 % mean decline
 * (log −0.172) against a stable person's log-change SD of √2 · ln 1.06 = 0.082 is a shift of
 * about 2.1 SD, and a one-sided limit of 2.24 SD catches it in about Φ((0.172 − 0.185)/0.082)
 * ≈ 44 % of pairs.
 * Run: npx tsx tests/validation/day2-oracle.ts [pairs] [firstSeed null] [firstSeed decline]
 */
import { bandFor, DEFAULT_BAND_TABLE } from '../../core/compare/bands';
import { changeCall } from '../../core/compare/change-interval';
import type { MetricId, Verdict } from '../../core/compare/types';
import { generateTest } from '../../sample-tests/generator';
import { generateKineticTest } from '../../sample-tests/kinetic-family';
import { pairParams, pairParamsB, type PairKind } from './day2-pairs';

export type OracleOutcome = 'vt1_vo2' | 'vt1_work' | 'peak_vo2' | 'peak_work';
export const ORACLE_OUTCOMES: readonly OracleOutcome[] = ['vt1_vo2', 'vt1_work', 'peak_vo2', 'peak_work'];

/** True values of one day: null where the model has none (a treadmill has no watts). */
export type TrueDay = Readonly<Record<OracleOutcome, number | null>>;

export interface TruePair {
  readonly seed: number;
  readonly day1: TrueDay;
  readonly day2: TrueDay;
}

export function truePairsA(kind: PairKind, count: number, firstSeed: number): TruePair[] {
  const out: TruePair[] = [];
  for (let seed = firstSeed; seed < firstSeed + count; seed++) {
    const [p1, p2] = pairParams(seed, kind);
    const day = (p: typeof p1, s: number): TrueDay => {
      const t = generateTest(p, s).truth;
      return { vt1_vo2: t.vt1.vo2MlMin, vt1_work: t.vt1.workW, peak_vo2: t.peak.vo2MlMin, peak_work: t.peak.workW };
    };
    // A seed the model cannot simulate would stop runPairs too; the held-out seeds have none.
    try {
      out.push({ seed, day1: day(p1, 2 * seed), day2: day(p2, 2 * seed + 1) });
    } catch {
      // skipped
    }
  }
  return out;
}

/** Family B, skipping (as runPairsB does) a seed whose day-2 parameters the model cannot simulate. */
export function truePairsB(kind: PairKind, count: number, firstSeed: number): TruePair[] {
  const out: TruePair[] = [];
  for (let seed = firstSeed; out.length < count; seed++) {
    const [p1, p2] = pairParamsB(seed, kind);
    try {
      const day = (p: typeof p1, s: number): TrueDay => {
        const t = generateKineticTest(p, s).truth;
        return { vt1_vo2: t.vt1.vo2MlMin, vt1_work: t.vt1.workW, peak_vo2: t.peak.vo2MlMin, peak_work: t.peak.workW };
      };
      out.push({ seed, day1: day(p1, 2 * seed), day2: day(p2, 2 * seed + 1) });
    } catch {
      // skipped, as in runPairsB
    }
  }
  return out;
}

/** The oracle's call per outcome: the comparison's rule with no measurement error. */
export function oracleCalls(pair: TruePair, z: number): Readonly<Record<OracleOutcome, Verdict>> {
  const out = {} as Record<OracleOutcome, Verdict>;
  for (const id of ORACLE_OUTCOMES) {
    const a = pair.day1[id];
    const b = pair.day2[id];
    const call = a !== null && b !== null ? changeCall(a, b, 0, 0, bandFor(id as MetricId, DEFAULT_BAND_TABLE), 'oracle', z) : null;
    out[id] = call ? call.verdict : 'not_comparable';
  }
  return out;
}

export interface OracleFigures {
  readonly n: number;
  readonly anyPrimaryFellPct: number;
  readonly vt1FellPct: number;
  readonly vt1Vo2FellPct: number;
  readonly vt1WorkFellPct: number;
  readonly anyPrimaryRosePct: number;
}

export function oracleFigures(pairs: readonly TruePair[], z: number): OracleFigures {
  const calls = pairs.map((p) => oracleCalls(p, z));
  const share = (f: (c: Readonly<Record<OracleOutcome, Verdict>>) => boolean) => (100 * calls.filter(f).length) / calls.length;
  return {
    n: pairs.length,
    anyPrimaryFellPct: share((c) => ORACLE_OUTCOMES.some((id) => c[id] === 'fell')),
    vt1FellPct: share((c) => c.vt1_vo2 === 'fell' || c.vt1_work === 'fell'),
    vt1Vo2FellPct: share((c) => c.vt1_vo2 === 'fell'),
    vt1WorkFellPct: share((c) => c.vt1_work === 'fell'),
    anyPrimaryRosePct: share((c) => ORACLE_OUTCOMES.some((id) => c[id] === 'rose')),
  };
}

if (process.argv[1]?.endsWith('day2-oracle.ts')) {
  const n = Number(process.argv[2] ?? 200);
  const zs = (process.env.ZS ?? '2.2414,2.1,1.96,1.645').split(',').map(Number);
  const sets: [string, TruePair[], TruePair[]][] = [
    ['family A', truePairsA('null', n, Number(process.argv[3] ?? 20001)), truePairsA('decline', n, Number(process.argv[4] ?? 30001))],
    ['family B', truePairsB('null', n, Number(process.argv[5] ?? 40001)), truePairsB('decline', n, Number(process.argv[6] ?? 45001))],
  ];
  for (const [name, nul, dec] of sets) {
    for (const z of zs) {
      const a = oracleFigures(nul, z);
      const d = oracleFigures(dec, z);
      console.log(
        `${name} z ${z}: null any-primary lower ${a.anyPrimaryFellPct.toFixed(1)} %, VT1 lower ${a.vt1FellPct.toFixed(1)} %; decline VT1 lower ${d.vt1FellPct.toFixed(1)} % (VO2 ${d.vt1Vo2FellPct.toFixed(1)}, workload ${d.vt1WorkFellPct.toFixed(1)}), opposite ${d.anyPrimaryRosePct.toFixed(1)} %`,
      );
    }
  }
}
