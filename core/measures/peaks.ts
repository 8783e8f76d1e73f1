/**
 * Peak values: for each variable, the highest mean over any trailing window of `windowS`
 * seconds (default 30 s, common practice) within the incremental phase. RER and O2 pulse are
 * ratios of the window means (VCO2/VO2; VO2/HR in mL/beat), not means of ratios. Peak work is
 * the highest load recorded (W). VO2/kg is peak VO2 ÷ body mass (mL/kg/min); METs =
 * VO2/kg ÷ 3.5 (common practice: 1 MET = 3.5 mL/kg/min). Exercise duration is the length of
 * the incremental phase (s).
 *
 * A window counts only once the phase has lasted windowS, so the first seconds never give
 * a "peak" over fewer breaths; a phase shorter than the window is averaged whole.
 *
 * Example: VO2/kg 24.5 mL/kg/min → 7.0 METs.
 */
import type { Breath } from '../model/breath-table';
import type { PeakValues, Phases } from '../model/analysis';

export function metsFromVo2MlKgMin(vo2MlKgMin: number): number {
  return vo2MlKgMin / 3.5;
}

export function rer(vco2MlMin: number, vo2MlMin: number): number {
  return vco2MlMin / vo2MlMin;
}

export function peakValues(
  breaths: readonly Breath[],
  phases: Pick<Phases, 'incrementalStartS' | 'incrementalEndS'>,
  weightKg: number | null,
  windowS: number,
): PeakValues {
  const phase = breaths.filter((b) => b.timeS >= phases.incrementalStartS && b.timeS <= phases.incrementalEndS);
  const use = phase.length > 0 ? phase : breaths;
  const best = { vo2: -Infinity, vco2: -Infinity, ve: -Infinity, rer: -Infinity, hr: -Infinity, o2p: -Infinity };
  const firstT = use[0]?.timeS ?? 0;
  const lastT = use[use.length - 1]?.timeS ?? 0;
  const short = lastT - firstT < windowS;
  let lo = 0;
  const sums = { vo2: 0, vco2: 0, ve: 0, hr: 0, hrN: 0, vo2WithHr: 0, n: 0 };
  for (let i = 0; i < use.length; i++) {
    const b = use[i];
    add(sums, b, 1);
    // lo < i: the window always keeps this breath, even when a time cell is huge (1e18 s) and b.timeS - windowS rounds to b.timeS.
    while (lo < i && use[lo].timeS <= b.timeS - windowS) add(sums, use[lo++], -1);
    if (!short && b.timeS - firstT < windowS) continue;
    if (short && i < use.length - 1) continue;
    best.vo2 = Math.max(best.vo2, sums.vo2 / sums.n);
    best.vco2 = Math.max(best.vco2, sums.vco2 / sums.n);
    best.ve = Math.max(best.ve, sums.ve / sums.n);
    best.rer = Math.max(best.rer, sums.vco2 / sums.vo2);
    if (sums.hrN > 0) {
      best.hr = Math.max(best.hr, sums.hr / sums.hrN);
      best.o2p = Math.max(best.o2p, sums.vo2WithHr / sums.hr);
    }
  }
  let work: number | null = null;
  for (const b of use) if (b.workW !== null) work = work === null ? b.workW : Math.max(work, b.workW);
  const vo2MlKgMin = weightKg !== null && weightKg > 0 && Number.isFinite(best.vo2) ? best.vo2 / weightKg : null;
  return {
    vo2MlMin: finite(best.vo2) ?? Number.NaN,
    vo2MlKgMin,
    vco2MlMin: finite(best.vco2) ?? Number.NaN,
    veLMin: finite(best.ve) ?? Number.NaN,
    rer: finite(best.rer) ?? Number.NaN,
    hrBpm: finite(best.hr),
    o2PulseMlBeat: finite(best.o2p),
    workW: work,
    mets: vo2MlKgMin === null ? null : metsFromVo2MlKgMin(vo2MlKgMin),
    exerciseDurationS: Math.max(0, phases.incrementalEndS - phases.incrementalStartS),
  };
}

function add(s: { vo2: number; vco2: number; ve: number; hr: number; hrN: number; vo2WithHr: number; n: number }, b: Breath, sign: 1 | -1) {
  s.vo2 += sign * b.vo2MlMin;
  s.vco2 += sign * b.vco2MlMin;
  s.ve += sign * b.veLMin;
  s.n += sign;
  if (b.hrBpm !== null) {
    s.hr += sign * b.hrBpm;
    s.hrN += sign;
    s.vo2WithHr += sign * b.vo2MlMin;
  }
}

function finite(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}
