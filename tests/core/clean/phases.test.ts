// Phases on synthetic protocols whose boundaries are known by construction (common practice:
// rest, warm-up hold, incremental load, recovery).
import { describe, expect, it } from 'vitest';
import { breath, type Breath } from '../../../core/model/breath-table';
import { findPhases } from '../../../core/clean/phases';

const NO_OVERRIDE = { incrementalStartS: null, incrementalEndS: null };

function protocol(loadAt: (t: number) => { workW?: number | null; speedKmh?: number | null; gradePct?: number | null }, endS: number, stepS = 3): Breath[] {
  const out: Breath[] = [];
  for (let t = 0; t <= endS; t += stepS) out.push(breath({ timeS: t, vo2MlMin: 1000, vco2MlMin: 900, veLMin: 30, ...loadAt(t) }));
  return out;
}

describe('findPhases', () => {
  it('finds rest, warm-up, a 15 W/min ramp and recovery', () => {
    // Rest 0–120 s at 0 W, warm-up 120–300 s at 20 W, ramp 20 + 15 W/min from 300 s rounded to
    // whole watts as an ergometer displays them, recovery at 20 W from 900 s.
    const ramp = protocol((t) => ({ workW: t < 120 ? 0 : t < 300 ? 20 : t < 900 ? Math.round(20 + (15 * (t - 300)) / 60) : 20 }), 1080);
    const p = findPhases(ramp, NO_OVERRIDE);
    expect(p.phases.map((x) => x.name)).toEqual(['rest', 'warmup', 'incremental', 'recovery']);
    // The ramp's line leaves 20 W at 300 s by construction; the rounded watts put its
    // least-squares line's crossing a little earlier, so the start is held at the hold's last
    // breath, 300 s (the 300 s breath still shows 20 W).
    expect(p.incrementalStartS).toBe(300);
    // Last ramp breath: 897 s (169 W); the next, 900 s, is back at 20 W.
    expect(p.incrementalEndS).toBe(897);
    expect(p.phases[1]).toEqual({ name: 'warmup', startS: 120, endS: 300 });
    // Rounding to whole watts leaves the least-squares slope within 0.1 W/min of 15.
    expect(p.rampWPerMin).toBeCloseTo(15, 1);
    expect(p.source).toBe('detected');
  });

  it('keeps the ramp whole when the recorded load dips by a watt now and then', () => {
    // The protocol of the first test, with every 7th ramp breath recorded 1 W low (as a
    // measured-power column or a display's rounding wavers). A dip is 1 W, under 2 % of the
    // 169 W peak; before, the first dip going back from the peak ended the rising chain and
    // the ramp was taken to start there (at 876 s, the last dip).
    const wavering = protocol((t) => {
      const set = t < 120 ? 0 : t < 300 ? 20 : t < 900 ? Math.round(20 + (15 * (t - 300)) / 60) : 20;
      return { workW: t > 300 && t < 900 && (t / 3) % 7 === 0 ? set - 1 : set };
    }, 1080);
    const p = findPhases(wavering, NO_OVERRIDE);
    expect(p.phases.map((x) => x.name)).toEqual(['rest', 'warmup', 'incremental', 'recovery']);
    // The dips lower the ramp's least-squares line a little, so it leaves 20 W just after the
    // hold's last breath (300 s) and before the first ramp breath (303 s).
    expect(p.incrementalStartS).toBeGreaterThanOrEqual(300);
    expect(p.incrementalStartS).toBeLessThan(303);
    expect(p.incrementalEndS).toBe(897);
    expect(p.rampWPerMin).toBeCloseTo(15, 0);
  });

  it('stops the chain at an earlier, harder bout', () => {
    // A 60 W familiarisation bout 0–120 s, rest 0 W 120–300 s, then a ramp of 15 W/min from 0 W:
    // going back from the peak the chain passes the rest and stops at the 60 W bout (60 W is far
    // above the lowest load met, 0 W), so the bout is rest-phase and not part of the ramp.
    const bout = protocol((t) => ({ workW: t < 120 ? 60 : t < 300 ? 0 : t < 900 ? Math.round((15 * (t - 300)) / 60) : 0 }), 1000);
    const p = findPhases(bout, NO_OVERRIDE);
    expect(p.incrementalStartS).toBe(300);
    expect(p.incrementalEndS).toBe(897);
  });

  it('starts a step protocol at the first step, not at the second', () => {
    // Rest without a load signal 0–60 s, warm-up 0 W 60–240 s, then 25 W steps every 120 s to
    // 150 W (6 steps, 240–960 s), recovery 0 W.
    const steps = protocol((t) => ({ workW: t < 60 ? null : t < 240 ? 0 : t < 960 ? 25 * (1 + Math.floor((t - 240) / 120)) : 0 }), 1100);
    const p = findPhases(steps, NO_OVERRIDE);
    expect(p.incrementalStartS).toBe(240);
    expect(p.incrementalEndS).toBe(957);
    expect(p.phases.map((x) => x.name)).toEqual(['rest', 'warmup', 'incremental', 'recovery']);
    // 25 W every 2 min is 12.5 W/min on average; the staircase's least-squares slope over
    // 240–957 s is close to that (within 0.5 W/min).
    expect(Math.abs((p.rampWPerMin ?? 0) - 12.5)).toBeLessThan(0.5);
  });

  it('tells a long warm-up from shorter stages', () => {
    // Rest 0 km/h 0–180 s, warm-up 2.5 km/h 180–360 s (180 s), then 60 s stages from 3 km/h, 2 %:
    // the warm-up lasts 3 × a stage (> 1.5 ×), so the incremental phase starts at 360 s.
    const tm = protocol(
      (t) => (t < 180 ? { speedKmh: 0, gradePct: 0 } : t < 360 ? { speedKmh: 2.5, gradePct: 0 } : t < 900 ? { speedKmh: 3 + 0.3 * Math.floor((t - 360) / 60), gradePct: 2 + 1.5 * Math.floor((t - 360) / 60) } : { speedKmh: 2, gradePct: 0 }),
      1000,
    );
    const p = findPhases(tm, NO_OVERRIDE);
    expect(p.incrementalStartS).toBe(360);
    expect(p.phases.map((x) => [x.name, x.startS])).toEqual([['rest', 0], ['warmup', 180], ['incremental', 360], ['recovery', 897]]);
  });

  it('reads a treadmill protocol from speed and grade', () => {
    // Warm-up 3 km/h, 0 % for 0–180 s; then steps every 60 s of +0.5 km/h and +1 % from
    // 4 km/h, 2 % (180–720 s); recovery 2 km/h, 0 %.
    const tm = protocol(
      (t) =>
        t < 180
          ? { speedKmh: 3, gradePct: 0 }
          : t < 720
            ? { speedKmh: 4 + 0.5 * Math.floor((t - 180) / 60), gradePct: 2 + Math.floor((t - 180) / 60) }
            : { speedKmh: 2, gradePct: 0 },
      900,
    );
    const p = findPhases(tm, NO_OVERRIDE);
    expect(p.incrementalStartS).toBe(180);
    expect(p.incrementalEndS).toBe(717);
    expect(p.rampWPerMin).toBeNull();
  });

  it('lets the settings override the limits', () => {
    const ramp = protocol((t) => ({ workW: t < 300 ? 20 : t < 900 ? 20 + Math.round((t - 300) / 4) : 20 }), 1080);
    const p = findPhases(ramp, { incrementalStartS: 330, incrementalEndS: null });
    expect(p.incrementalStartS).toBe(330);
    expect(p.incrementalEndS).toBe(897);
    expect(p.source).toBe('user');
  });

  it('treats a recording without load as all incremental', () => {
    const p = findPhases(protocol(() => ({}), 600), NO_OVERRIDE);
    expect([p.incrementalStartS, p.incrementalEndS]).toEqual([0, 600]);
    expect(p.phases.map((x) => x.name)).toEqual(['incremental']);
  });
});
