/**
 * Development runs for the threshold detectors, on the development seeds only
 * (DEVELOPMENT_FIRST_SEED, same conditions as the validation): per-method errors and candidate
 * combinations, printed as a table. Run: npx tsx tests/validation/develop.ts [seedsPerCondition]
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { findThresholds, KINETIC_LAG_S, estimateThreshold } from '../../core/thresholds/find-thresholds';
import { VT1_METHODS, VT2_METHODS } from '../../core/thresholds/methods';
import { generateTest } from '../../sample-tests/generator';
import { sharedKnotFit } from '../../core/thresholds/shared-knot';
import { windowPoints } from '../../core/thresholds/window';
import { minPerSide } from '../../core/thresholds/edge-floor';
import type { ProcessedSeries } from '../../core/model/analysis';

import { locallySmoothedVo2 } from '../../core/thresholds/smooth-vo2';

function joint(series: ProcessedSeries, fromS: number, toS: number, withVe: boolean, w = 0): number | undefined {
  const sm = w > 0 ? locallySmoothedVo2(series, w) : null;
  const ok = (i: number) => Number.isFinite(series.vo2MlMin[i]) && Number.isFinite(series.vco2MlMin[i]) && Number.isFinite(series.veLMin[i]);
  const x = windowPoints(series, fromS, toS, (i) => (ok(i) ? (sm ? sm[i] : series.vo2MlMin[i]) : null)).value;
  const y1 = windowPoints(series, fromS, toS, (i) => (ok(i) ? series.vco2MlMin[i] : null)).value;
  const y2 = windowPoints(series, fromS, toS, (i) => (ok(i) ? series.veLMin[i] : null)).value;
  const f = sharedKnotFit(x, withVe ? [y1, y2] : [y1], minPerSide(DEFAULT_SETTINGS, x.length));
  return f?.knot;
}
import { DEVELOPMENT_FIRST_SEED, validationCases } from './cases';

const k = Number(process.argv[2] ?? 2);
const errs = new Map<string, number[]>();
const worst: [number, string][] = [];
const add = (name: string, v: number) => errs.set(name, [...(errs.get(name) ?? []), v]);
for (const c of validationCases(k, DEVELOPMENT_FIRST_SEED)) {
  const { table, truth } = generateTest(c.params, c.seed);
  const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
  const t1 = truth.vt1.vo2MlMin;
  const t2 = truth.vt2.vo2MlMin;
  const e = (v: number | undefined, t: number) => (v === undefined ? 100 : (100 * (v - t)) / t);
  add('VT1 pipeline', e(a.vt1.at?.vo2MlMin, t1));
  add('VT2 pipeline', e(a.vt2.at?.vo2MlMin, t2));
  const inc = [a.phases.incrementalStartS, a.phases.incrementalEndS];
  const prelim = estimateThreshold('vt2', VT2_METHODS, { series: a.series, fromS: inc[0], toS: inc[1], settings: DEFAULT_SETTINGS }, [inc[0], inc[1]], false);
  const to = prelim.consensus?.timeS ?? inc[1];
  add('J co2+ve pipeline window', e(joint(a.series, inc[0] + KINETIC_LAG_S, to, true), t1));
  for (const w of [30, 60, 90, 120]) add(`J co2+ve smooth ${w}`, e(joint(a.series, inc[0] + KINETIC_LAG_S, to, true, w), t1));
  for (const w of [60, 120]) add(`J co2 smooth ${w}`, e(joint(a.series, inc[0] + KINETIC_LAG_S, to, false, w), t1));
  for (const w of [60, 120]) add(`J co2+ve smooth ${w} true window`, e(joint(a.series, inc[0] + KINETIC_LAG_S, truth.vt2.timeS, true, w), t1));
  add('J co2 only pipeline window', e(joint(a.series, inc[0] + KINETIC_LAG_S, to, false), t1));
  add('J co2+ve true window', e(joint(a.series, inc[0] + KINETIC_LAG_S, truth.vt2.timeS, true), t1));
  add('J co2 true window', e(joint(a.series, inc[0] + KINETIC_LAG_S, truth.vt2.timeS, false), t1));
  const jv = joint(a.series, inc[0] + KINETIC_LAG_S, to, true, 60);
  worst.push([Math.abs(e(jv, t1)), `${c.label} seed ${c.seed}: truth VT1 ${t1} VT2 ${t2} peak ${c.params.vo2PeakMlMin}; joint ${jv?.toFixed(0)}; prelimVT2 ${prelim.consensus?.vo2MlMin.toFixed(0)}; vt1 at ramp+${(truth.vt1.timeS - inc[0]).toFixed(0)}s vt2 at ramp+${(truth.vt2.timeS - inc[0]).toFixed(0)}s end ramp+${(inc[1]-inc[0]).toFixed(0)}; pipeline ${a.vt1.at?.vo2MlMin.toFixed(0)}`]);
  add('prelim VT2', e(prelim.consensus?.vo2MlMin, t2));
  {
    const f = a.vt1.methods.filter((m) => m.found) as { method: string; vo2MlMin: number }[];
    const pv = f.find((m) => m.method === 'vslope-ve');
    const rest = f.filter((m) => m.method !== 'vslope-ve').map((m) => m.vo2MlMin);
    add('B primary vslope-ve else median', e(pv ? pv.vo2MlMin : rest.length ? median(rest) : undefined, t1));
    const unb = f.filter((m) => ['vslope-ve', 'vslope-hinge', 've-vo2'].includes(m.method)).map((m) => m.vo2MlMin);
    add('C median of vslope-ve, vslope-hinge, ve-vo2', e(unb.length ? median(unb) : rest.length ? median(rest) : undefined, t1));
  }
  for (const m of a.vt1.methods) add(`vt1 ${m.method}`, m.found ? e(m.vo2MlMin, t1) : 100);
  for (const m of a.vt2.methods) add(`vt2 ${m.method}`, m.found ? e(m.vo2MlMin, t2) : 100);
}
console.log('| name | median abs % | p95 abs % | signed median % | misses |');
for (const [name, v] of errs) {
  const abs = v.map(Math.abs);
  console.log(`| ${name} | ${median(abs).toFixed(1)} | ${quantile(abs, 0.95).toFixed(1)} | ${median(v).toFixed(1)} | ${v.filter((x) => x === 100).length} |`);
}

worst.sort((a, b) => b[0] - a[0]);

