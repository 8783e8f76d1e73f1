/**
 * Development only: where the error of the work rate at VT1 comes from, and alternative ways of
 * reading it, on DEVELOPMENT seeds of both families (cycle tests of the main grids).
 * Run: npx tsx tests/validation/work-dev.ts [seedsPerCell=5]
 *
 * Both generators define the true work rate at VT1 as the load at the moment the threshold
 * occurs (family 1: the first time the noise-free VO2 reaches the VT1 VO2; family B: the moment
 * the CO2-side metabolic rate reaches the buffering centre), so the analysis reads the work at
 * the consensus time. Rows (signed error of the work, % of the true work, cycle tests only):
 * - `as released`: the analysis's own reading (work at the consensus time, which is read off the
 *   monotone VO2 curve at the consensus VO2);
 * - `smoothed VO2 ±h s`: the time where VO2 smoothed by a local line over ±h s first reaches
 *   the consensus VO2 (the x-axis of vslope-ve at h = 60);
 * - `VO2 line over …`: the time where one straight line of VO2 on time (the ramp after its first
 *   minute, i.e. ΔVO2/ΔWR with the kinetic lag carried in the line's intercept) reaches it;
 * - `own time of <method>`: each method's own time;
 * - `true VO2 read off`: the true VT1 VO2 read off the ±90 s smoothed curve, the error that the
 *   reading alone adds when the VO2 is right;
 * - `implied by the VO2 error`: (found − true VO2) / (ΔVO2/ΔWR × true work), the work error a
 *   perfect reading would still carry from the VO2 error.
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { locallySmoothed } from '../../core/thresholds/smooth-vo2';
import { timeAtValue, vco2Curve } from '../../core/thresholds/read-off';
import { DEVELOPMENT_FIRST_SEED, mainCases } from './cases';
import { familyBCases } from './family-b';
import { family1, type TruthCase } from './measure';

const k = Number(process.argv[2] ?? 5);
const sets: [string, TruthCase[]][] = [
  ['family 1 main', family1(mainCases(k, DEVELOPMENT_FIRST_SEED)).filter((c) => c.modality === 'cycle')],
  ['family B main', familyBCases('development', k * 12).filter((c) => c.condition === 'main' && c.modality === 'cycle')],
];

/** Linear interpolation of a nullable series at a time (clamped). */
function interp(t: readonly number[], v: readonly (number | null)[], at: number): number | null {
  let i = 0;
  while (i < t.length - 2 && t[i + 1] < at) i++;
  const a = v[i];
  const b = v[i + 1];
  if (a === null || b === null) return null;
  const f = Math.max(0, Math.min(1, (at - t[i]) / (t[i + 1] - t[i])));
  return a + f * (b - a);
}

/** First time within [from, to] at which v reaches value (linear between points); `to` if never. */
function firstCrossing(t: readonly number[], v: ArrayLike<number>, from: number, to: number, value: number): number {
  let prevT = Number.NaN;
  let prevV = Number.NaN;
  for (let i = 0; i < t.length; i++) {
    if (t[i] < from || t[i] > to || !Number.isFinite(v[i])) continue;
    if (v[i] >= value) return Number.isFinite(prevV) ? prevT + ((value - prevV) / (v[i] - prevV)) * (t[i] - prevT) : t[i];
    prevT = t[i];
    prevV = v[i];
  }
  return to;
}

function line(x: readonly number[], y: readonly number[]): { a: number; b: number } {
  const n = x.length;
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - mx) ** 2;
    sxy += (x[i] - mx) * (y[i] - my);
  }
  const b = sxy / sxx;
  return { a: my - b * mx, b };
}

const stat = (xs: readonly number[]) =>
  `median ${median(xs.map(Math.abs)).toFixed(1)} p95 ${quantile(xs.map(Math.abs), 0.95).toFixed(1)} bias ${median(xs).toFixed(1)}`;

for (const [name, cases] of sets) {
  const rows = new Map<string, number[]>();
  const add = (key: string, v: number) => rows.set(key, [...(rows.get(key) ?? []), v]);
  for (const c of cases) {
    const g = c.generate();
    const trueWork = g.vt1.workW;
    const a = analyzeTest(g.table, DEFAULT_SETTINGS, noClinicalInputs());
    const at = a.vt1.at;
    if (!at || trueWork === null) continue;
    const s = a.series;
    const inc0 = a.phases.incrementalStartS;
    const inc1 = a.phases.incrementalEndS;
    const v = at.vo2MlMin;
    const pct = (w: number | null) => (w === null ? 100 : (100 * (w - trueWork)) / trueWork);
    const workAt = (timeS: number) => pct(interp(s.timeS, s.workW, timeS));
    add('VO2 at VT1 (for reference)', (100 * (v - g.vt1.vo2MlMin)) / g.vt1.vo2MlMin);
    add('as released', pct(at.workW));
    for (const h of [30, 60, 90]) add(`smoothed VO2 ±${h} s`, workAt(firstCrossing(s.timeS, locallySmoothed(s.timeS, s.vo2MlMin, h), inc0 + 60, inc1, v)));
    const vt2S = a.vt2.at?.timeS ?? inc1;
    const spans: [string, number, number][] = [
      ['VO2 line over the ramp to VT2', inc0 + 60, vt2S],
      ['VO2 line over the whole ramp', inc0 + 60, inc1],
      ['VO2 line over ±120 s', at.timeS - 120, at.timeS + 120],
      ['VO2 line over ±180 s', at.timeS - 180, at.timeS + 180],
    ];
    for (const [label, from, to] of spans) {
      const xs: number[] = [];
      const ys: number[] = [];
      for (let i = 0; i < s.timeS.length; i++) {
        const ti = s.timeS[i];
        if (ti >= Math.max(from, inc0 + 60) && ti <= Math.min(to, inc1) && Number.isFinite(s.vo2MlMin[i])) {
          xs.push(ti);
          ys.push(s.vo2MlMin[i]);
        }
      }
      const f = line(xs, ys);
      add(label, workAt((v - f.a) / f.b));
    }
    for (const m of a.vt1.methods) if (m.found) add(`own time of ${m.method}`, workAt(m.timeS));
    const ev = a.vt1.methods.find((m) => m.method === 'vslope-ve' && m.found) ?? a.vt1.methods.find((m) => m.method === 'vslope-hinge' && m.found);
    if (ev && ev.found && ev.evidence) {
      const seg = ev.evidence.segments[0];
      const vco2 = seg.intercept + seg.slope * v;
      const tc = timeAtValue(vco2Curve(s, inc0, inc1), vco2);
      add('VCO2 curve at the fitted VCO2', workAt(tc));
      add('mean of VO2 and VCO2 curve times', workAt((tc + at.timeS) / 2));
    }
    add('true VO2 read off (±90 s smooth)', workAt(firstCrossing(s.timeS, locallySmoothed(s.timeS, s.vo2MlMin, 90), inc0 + 60, inc1, g.vt1.vo2MlMin)));
    const gain = a.derived.dVo2dWrMlMinW;
    if (gain) add('implied by the VO2 error', (100 * (v - g.vt1.vo2MlMin)) / (gain * trueWork));
  }
  console.log(`\n## ${name}, cycle tests (development seeds, ${cases.length})`);
  for (const [key, xs] of rows) console.log(`${key.padEnd(36)} n ${String(xs.length).padStart(3)}  ${stat(xs)}`);
}
