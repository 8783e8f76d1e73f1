/**
 * VO2 as the x-axis of the gas-exchange plots, with less noise: at each time, the local linear
 * least-squares fit of VO2 against time over ±halfWidthS, evaluated at that time.
 *
 * Why: on the V-slope plot (VCO2 against VO2) both axes carry breath-to-breath noise. Noise in
 * the x-axis flattens the fitted slopes and blurs the bend (regression dilution, errors in
 * variables); replacing the noisy x by its expected value given time is regression calibration
 * (Carroll et al., Measurement Error in Nonlinear Models, 2nd ed.
 * 2006, ch. 4). VO2 follows the load smoothly (first-order kinetics, no bend at VT1), so a
 * local straight line over a minute or two follows it closely; VCO2 and VE keep their own
 * (15-s averaged) values, so the bend the method looks for is left untouched.
 * Local linear fit: Fan et al., Local Polynomial Modelling and Its Applications, 1996
 * (uniform kernel, our choice for a linear-time sliding computation). Units: s, mL/min.
 * Assumption: timeS is in increasing order; non-finite VO2 values are skipped.
 */
import type { ProcessedSeries } from '../model/analysis';

/** Smoothed VO2 at every index of the series (NaN where no neighbour has a finite VO2). */
export function locallySmoothedVo2(series: ProcessedSeries, halfWidthS: number): Float64Array {
  return locallySmoothed(series.timeS, series.vo2MlMin, halfWidthS);
}

/** The same local linear smooth of any variable against time (NaN where no neighbour is finite). */
export function locallySmoothed(t: readonly number[], v: readonly number[], halfWidthS: number): Float64Array {
  const n = t.length;
  const out = new Float64Array(n).fill(Number.NaN);
  let lo = 0;
  let hi = 0;
  // Running sums over the window, times taken relative to the current centre's window start
  // would drift; relative to t[0] keeps them small enough for double precision over an hour.
  const t0 = n > 0 ? t[0] : 0;
  // The sums are plain locals updated in the loop: captured by a closure they would live in a
  // heap context, and every update of a captured double allocates (measured 100 ns per point).
  let sw = 0;
  let st = 0;
  let stt = 0;
  let sv = 0;
  let stv = 0;
  for (let i = 0; i < n; i++) {
    const right = t[i] + halfWidthS;
    for (; hi < n && t[hi] <= right; hi++) {
      const vi = v[hi];
      const ti = t[hi] - t0;
      if (!Number.isFinite(vi) || !Number.isFinite(ti)) continue;
      sw += 1;
      st += ti;
      stt += ti * ti;
      sv += vi;
      stv += ti * vi;
    }
    const left = t[i] - halfWidthS;
    for (; lo < hi && t[lo] < left; lo++) {
      const vi = v[lo];
      const ti = t[lo] - t0;
      if (!Number.isFinite(vi) || !Number.isFinite(ti)) continue;
      sw -= 1;
      st -= ti;
      stt -= ti * ti;
      sv -= vi;
      stv -= ti * vi;
    }
    if (sw < 1) continue;
    const ti = t[i] - t0;
    const mt = st / sw;
    const varT = stt / sw - mt * mt;
    const mv = sv / sw;
    const slope = varT > 1e-9 ? (stv / sw - mt * mv) / varT : 0;
    out[i] = mv + slope * (ti - mt);
  }
  return out;
}
