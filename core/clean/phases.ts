/**
 * Test phases (rest, warm-up/unloaded, incremental, recovery) found from the load, and the
 * ramp rate in W/min.
 *
 * The load is the ergometer work (W) when recorded; on a treadmill without work it is the
 * speed-and-grade term of the ACSM walking equation, 0.1·S + 1.8·S·G mL/kg/min with S in
 * m/min and G as a fraction (ACSM's Guidelines for Exercise Testing and Prescription
 * (memory)); only its order matters here.
 *
 * Rule (common practice, stated so a reviewer can check it):
 * 1. Split the breaths into runs of constant load (within 0.5 W, or 0.05 on the treadmill
 *    scale). A breath without a load ends a run.
 * 2. The end of the incremental phase is the last breath of the highest-load run; every
 *    breath after it is recovery.
 * 3. Walk back from that run through runs of lower load (a dip of less than 2 % of the peak
 *    load below the lowest load met so far is let through, so a load that wavers by a watt
 *    does not end the chain). The first run of this chain is the pre-exercise level. The
 *    incremental phase starts at the next run, unless
 *    that run is itself held for at least 60 s and followed either by a run shorter than 60 s
 *    (a warm-up hold before a ramp) or by a run less than 1/1.5 as long (a warm-up before
 *    shorter stages), in which case it starts one run later.
 * 4. On a ramp the start is refined to where the least-squares line of load on time leaves
 *    the level of the hold before it (the load rises between breaths), never before the last
 *    breath of that hold.
 * 5. The hold just before the incremental phase is the warm-up; anything earlier is rest.
 * 6. Ramp rate: least-squares slope of work on time over the incremental phase × 60.
 * Settings `clean.phases` overrides the start and end (source 'user').
 * Without any load signal the whole recording is treated as incremental.
 */
import type { Breath } from '../model/breath-table';
import type { Phase, Phases } from '../model/analysis';
import type { PhaseOverrides } from '../model/settings';
import { linearFit } from '../math/linear-fit';

/** Shortest hold (s) that counts as a warm-up level rather than a ramp increment. */
const WARMUP_HOLD_S = 60;
/** A first step held this many times longer than the next is a warm-up, not a stage. */
const STAGE_RATIO = 1.5;
/** A dip in the recorded load smaller than this share of the peak load does not end the rising chain (our choice). */
const DIP_SHARE = 0.02;

interface Run {
  readonly load: number;
  readonly first: number;
  readonly last: number;
}

/** The load of each breath on one scale (W, or the treadmill term), null where unknown. */
export function loadSignal(breaths: readonly Breath[]): { load: (number | null)[]; tolerance: number } | null {
  if (breaths.some((b) => b.workW !== null)) return { load: breaths.map((b) => b.workW), tolerance: 0.5 };
  if (breaths.some((b) => b.speedKmh !== null)) {
    const load = breaths.map((b) => {
      if (b.speedKmh === null) return null;
      const sMMin = (b.speedKmh * 1000) / 60;
      return 0.1 * sMMin + 1.8 * sMMin * ((b.gradePct ?? 0) / 100);
    });
    return { load, tolerance: 0.05 };
  }
  return null;
}

export function findPhases(breaths: readonly Breath[], overrides: PhaseOverrides): Phases {
  if (breaths.length === 0) {
    return { phases: [], incrementalStartS: 0, incrementalEndS: 0, rampWPerMin: null, source: 'detected' };
  }
  const t0 = breaths[0].timeS;
  const tEnd = breaths[breaths.length - 1].timeS;
  const signal = loadSignal(breaths);
  let detected = { warmupStartS: null as number | null, startS: t0, endS: tEnd };
  if (signal) detected = detectFromLoad(breaths, signal.load, signal.tolerance) ?? detected;

  const user = overrides.incrementalStartS !== null || overrides.incrementalEndS !== null;
  const startS = overrides.incrementalStartS ?? detected.startS;
  const endS = overrides.incrementalEndS ?? detected.endS;
  const warmupStartS = detected.warmupStartS !== null && detected.warmupStartS < startS ? detected.warmupStartS : null;

  const phases: Phase[] = [];
  if (warmupStartS !== null && warmupStartS > t0) phases.push({ name: 'rest', startS: t0, endS: warmupStartS });
  if (warmupStartS !== null) phases.push({ name: 'warmup', startS: warmupStartS, endS: startS });
  else if (startS > t0) phases.push({ name: 'rest', startS: t0, endS: startS });
  phases.push({ name: 'incremental', startS, endS });
  if (endS < tEnd) phases.push({ name: 'recovery', startS: endS, endS: tEnd });

  return {
    phases,
    incrementalStartS: startS,
    incrementalEndS: endS,
    rampWPerMin: rampRate(breaths, startS, endS),
    source: user ? 'user' : 'detected',
  };
}

function detectFromLoad(
  breaths: readonly Breath[],
  load: readonly (number | null)[],
  tolerance: number,
): { warmupStartS: number | null; startS: number; endS: number } | null {
  const runs = splitRuns(load, tolerance);
  if (runs.length === 0) return null;
  let peak = 0;
  for (let k = 1; k < runs.length; k++) if (runs[k].load >= runs[peak].load) peak = k;
  // A recorded load may dip for a breath (measured power, a display rounding, breaths of two
  // recordings at one time): the chain goes on through a dip of up to `dip` below the lowest
  // load met so far, and stops at a load above that (an earlier, harder bout).
  const dip = Math.max(2 * tolerance, DIP_SHARE * runs[peak].load);
  let c0 = peak;
  let lowest = runs[peak].load;
  while (c0 > 0 && runs[c0 - 1].last + 1 === runs[c0].first && runs[c0 - 1].load < lowest + dip) {
    c0--;
    lowest = Math.min(lowest, runs[c0].load);
  }
  const endS = breaths[runs[peak].last].timeS;
  if (c0 === peak) return { warmupStartS: null, startS: breaths[runs[peak].first].timeS, endS };

  const duration = (k: number) =>
    k + 1 < runs.length ? breaths[runs[k + 1].first].timeS - breaths[runs[k].first].timeS : breaths[runs[k].last].timeS - breaths[runs[k].first].timeS;
  let first = c0 + 1;
  if (first + 1 <= peak && duration(first) >= WARMUP_HOLD_S) {
    const next = duration(first + 1);
    if (next < WARMUP_HOLD_S || duration(first) > STAGE_RATIO * next) first++;
  }
  const hold = runs[first - 1];
  let startS = breaths[runs[first].first].timeS;
  // On a ramp the load rises between breaths: place the start where the ramp's least-squares
  // line leaves the hold's level, bounded by the last breath of the hold and the first of the ramp.
  if (duration(first) < WARMUP_HOLD_S) {
    const fit = rampFit(breaths, load, runs[first].first, runs[peak].last);
    if (fit && fit.slope > 0) {
      const crossing = (hold.load - fit.intercept) / fit.slope;
      startS = Math.min(startS, Math.max(breaths[hold.last].timeS, crossing));
    }
  }
  return { warmupStartS: breaths[hold.first].timeS, startS, endS };
}

function rampFit(breaths: readonly Breath[], load: readonly (number | null)[], from: number, to: number) {
  // Typed arrays: see core/thresholds/window.ts.
  const t = new Float64Array(Math.max(0, to - from + 1));
  const y = new Float64Array(Math.max(0, to - from + 1));
  let k = 0;
  for (let i = from; i <= to; i++) {
    const v = load[i];
    if (v !== null) {
      t[k] = breaths[i].timeS;
      y[k++] = v;
    }
  }
  return linearFit(t.subarray(0, k), y.subarray(0, k));
}

function splitRuns(load: readonly (number | null)[], tolerance: number): Run[] {
  const runs: Run[] = [];
  let current: { load: number; first: number; last: number } | null = null;
  for (let i = 0; i < load.length; i++) {
    const value = load[i];
    if (value === null) {
      if (current) runs.push(current);
      current = null;
    } else if (current && Math.abs(value - current.load) <= tolerance) {
      current.last = i;
    } else {
      if (current) runs.push(current);
      current = { load: value, first: i, last: i };
    }
  }
  if (current) runs.push(current);
  return runs;
}

function rampRate(breaths: readonly Breath[], startS: number, endS: number): number | null {
  const t = new Float64Array(breaths.length);
  const w = new Float64Array(breaths.length);
  let k = 0;
  for (const b of breaths) {
    if (b.workW !== null && b.timeS >= startS && b.timeS <= endS) {
      t[k] = b.timeS;
      w[k++] = b.workW;
    }
  }
  const fit = linearFit(t.subarray(0, k), w.subarray(0, k));
  return fit ? fit.slope * 60 : null;
}
