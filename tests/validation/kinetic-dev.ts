/**
 * Development only (development seeds, 5000 and up; never the held-out ones): VT1 by V-slope
 * fits whose x-axis is a kinetic model of VO2 in time instead of VO2 smoothed over ±60 s, and
 * an errors-in-variables split. Not released (docs/validation.md, "Tried in this pass and not
 * kept", items 7–8).
 *
 * The model: during a ramp that starts at t0, VO2 follows the load with first-order kinetics,
 * so for a load rising linearly the response is the lagged ramp
 *   VO2(t) = base + S·g1(u),  g1(u) = u − τ·(1 − e^(−u/τ)),  u = max(0, t − t0)
 * (beyond a few τ: base + S·(t − t0 − τ), the mean response time τ as the lag: Whipp et al.,
 * J Appl Physiol 1981;50:217–21, the ramp response and its MRT — memory; MRT of about 30–45 s
 * in healthy adults — memory), plus Q·g2(u), g2(u) = u² − 2τu + 2τ²(1 − e^(−u/τ)), the
 * first-order response to a quadratic load term (a treadmill ramp of speed and grade: the ACSM
 * walking equation has a speed × grade term). For a fixed τ the model is linear in (base, S, Q):
 * closed-form least squares; τ is fixed or profiled on a grid. The warm-up anchor minute (u = 0)
 * sets the base. VCO2 and VE are then fitted as continuous two-segment lines of the MODEL VO2
 * (shared knot as `vslope-ve`, with the same breath-size covariate and V-slope acceptance; or
 * VCO2 alone as `vslope-hinge`; V-slope after Beaver et al., J Appl Physiol 1986;60:2020–7), so
 * VO2's breath noise no longer enters the x-axis.
 *
 * Variants: 'kin-ve lin|quad [tauN]' (shared knot; lin without g2; tauN fixed τ = N s, else
 * profiled), 'kin-ve quad tau30 lag' (VCO2 and VE against the model VO2 d s earlier, d in
 * 0–30 s profiled), 'kin-ve quad noadj' (no breath-size covariate), 'kin-hinge …' (VCO2 only;
 * adj = with the covariate), 'deming raw' (two total-least-squares lines of raw VCO2 on raw
 * VO2, λ = 1). 'vslope-ve x recomputed' rebuilds the release's `vslope-ve` from the same
 * points, as a check of the tool (it must equal `vslope-ve`).
 *
 * Run: npx tsx tests/validation/kinetic-dev.ts [seedsPerCell=5] [families=1,B] [firstSeeds=5000 (comma list)]
 * (ONLY=variant,variant restricts the variants; PAIRS=text restricts the consensus rows;
 * HARD=1 measures the short-or-noisy condition instead of the main grid.) Prints each variant's
 * own bias / spread / median / p95 and candidate consensus figures beside the release's,
 * formed from the methods' own errors as the release forms its consensus (median of the
 * leading pair, 10 % guard against the median of all found).
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import type { ProcessedSeries } from '../../core/model/analysis';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { minPerSide } from '../../core/thresholds/edge-floor';
import { estimateThreshold, vt1Window, vt2Bound } from '../../core/thresholds/find-thresholds';
import { VT2_METHODS } from '../../core/thresholds/methods';
import { hingeFit, preparePoints } from '../../core/thresholds/segments';
import { sharedKnotFit } from '../../core/thresholds/shared-knot';
import { locallySmoothed } from '../../core/thresholds/smooth-vo2';
import { withoutBreathScatter } from '../../core/thresholds/vslope-shared';
import { vslopeSlopeReason } from '../../core/thresholds/vslope-hinge';
import { DEVELOPMENT_FIRST_SEED, HARD_SEED_OFFSET, hardCases, mainCases } from './cases';
import { developmentSeedProblem } from './coverage-sets';
import { kineticCases } from '../../sample-tests/kinetic-family';
import { familyBCase } from './family-b';
import { family1, type TruthCase } from './measure';

const TAUS = [15, 25, 35, 45, 55, 70, 90];

interface Pts {
  t: number[];
  vo2: number[];
  vco2: number[];
  ve: number[];
  smVo2: number[];
  smCo2: number[];
  smVe: number[];
}

function windowPts(series: ProcessedSeries, fromS: number, toS: number): Pts {
  const sm = locallySmoothed(series.timeS, series.vo2MlMin, 60);
  const sc = locallySmoothed(series.timeS, series.vco2MlMin, 60);
  const se = locallySmoothed(series.timeS, series.veLMin, 60);
  const p: Pts = { t: [], vo2: [], vco2: [], ve: [], smVo2: [], smCo2: [], smVe: [] };
  for (let i = 0; i < series.timeS.length; i++) {
    const t = series.timeS[i];
    if (!(t >= fromS && t <= toS)) continue;
    const v = [series.vo2MlMin[i], series.vco2MlMin[i], series.veLMin[i], sm[i], sc[i], se[i]];
    if (!v.every(Number.isFinite)) continue;
    p.t.push(t);
    p.vo2.push(v[0]);
    p.vco2.push(v[1]);
    p.ve.push(v[2]);
    p.smVo2.push(v[3]);
    p.smCo2.push(v[4]);
    p.smVe.push(v[5]);
  }
  return p;
}

/** Ordinary least squares by the normal equations (three columns at most): coefficients, or null when singular. */
function olsBeta(cols: readonly number[][], y: readonly number[]): number[] | null {
  const k = cols.length;
  const a: number[][] = Array.from({ length: k }, (_, i) =>
    Array.from({ length: k + 1 }, (_, j) => {
      let s = 0;
      for (let r = 0; r < y.length; r++) s += cols[i][r] * (j < k ? cols[j][r] : y[r]);
      return s;
    }),
  );
  for (let c = 0; c < k; c++) {
    let piv = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) piv = r;
    [a[c], a[piv]] = [a[piv], a[c]];
    if (!(Math.abs(a[c][c]) > 1e-12)) return null;
    for (let r = 0; r < k; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let j = c; j <= k; j++) a[r][j] -= f * a[c][j];
    }
  }
  return a.map((row, i) => row[k] / row[i]);
}

/** The model's columns at times ts: 1, g1, and g2 when quadratic (time in min, so the columns are of similar size). */
function kineticColumns(ts: readonly number[], t0: number, tau: number, quadratic: boolean): number[][] {
  const u = ts.map((t) => Math.max(0, t - t0));
  const e = u.map((x) => 1 - Math.exp(-x / tau));
  const g1 = u.map((x, i) => (x - tau * e[i]) / 60);
  const g2 = u.map((x, i) => (x * x - 2 * tau * x + 2 * tau * tau * e[i]) / 3600);
  return [ts.map(() => 1), g1, ...(quadratic ? [g2] : [])];
}

/**
 * The kinetic VO2 model fitted to the window's VO2 and evaluated at `at` (default: the window's
 * own times); τ fixed, or profiled over TAUS by the residual sum of squares.
 */
function kineticVo2(p: Pts, t0: number, quadratic: boolean, tauFixed?: number, at: readonly number[] = p.t): number[] | null {
  let best: { tau: number; beta: number[]; rss: number } | null = null;
  for (const tau of tauFixed ? [tauFixed] : TAUS) {
    const cols = kineticColumns(p.t, t0, tau, quadratic);
    const beta = olsBeta(cols, p.vo2);
    if (!beta) continue;
    let rss = 0;
    for (let r = 0; r < p.vo2.length; r++) rss += (p.vo2[r] - cols.reduce((s, col, i) => s + beta[i] * col[r], 0)) ** 2;
    if (!best || rss < best.rss) best = { tau, beta, rss };
  }
  if (!best) return null;
  const { tau, beta } = best;
  const cols = kineticColumns(at, t0, tau, quadratic);
  return at.map((_, r) => cols.reduce((s, col, i) => s + beta[i] * col[r], 0));
}

/**
 * VCO2 and VE against the model VO2 d seconds earlier (VCO2 kinetics slower than VO2's), d
 * profiled over LAGS by the shared criterion; the knot is the model VO2 at the bend's time − d.
 */
const LAGS = [0, 10, 20, 30];
function laggedVariant(p: Pts, t0: number, m: number, tau: number): number | null {
  const x = kineticVo2(p, t0, true, tau);
  if (!x) return null;
  const { co2, ve } = adjusted(p, x);
  let best: { crit: number; knot: number } | null = null;
  for (const d of LAGS) {
    const xs = kineticVo2(p, t0, true, tau, p.t.map((t) => t - d));
    if (!xs) continue;
    const fit = sharedKnotFit(xs, [co2, ve], m);
    if (!fit) continue;
    const [c, v] = fit.lines;
    if (vslopeSlopeReason(c.slopeBefore, c.slopeAfter) || !(v.slopeAfter > v.slopeBefore)) continue;
    if (!best || fit.criterion < best.crit) best = { crit: fit.criterion, knot: fit.knot };
  }
  return best?.knot ?? null;
}

/** Errors-in-variables two-line split: orthogonal (total least squares) RSS of a line each side, λ = 1 (VO2 and VCO2 in mL/min with breath noise of similar size: memory), knot over data x. */
function demingHinge(x: number[], y: number[], m: number): number | null {
  const n = x.length;
  if (n < 2 * m + 1) return null;
  const order = x.map((_, i) => i).sort((a, b) => x[a] - x[b]);
  let best = Infinity;
  let bestK: number | null = null;
  for (let j = m - 1; j <= n - m - 1; j++) {
    const k = x[order[j]];
    const left = order.slice(0, j + 1);
    const right = order.slice(j + 1);
    const tls = (idx: number[]) => {
      const mx = idx.reduce((s, i) => s + x[i], 0) / idx.length;
      const my = idx.reduce((s, i) => s + y[i], 0) / idx.length;
      let sxx = 0, syy = 0, sxy = 0;
      for (const i of idx) {
        sxx += (x[i] - mx) ** 2;
        syy += (y[i] - my) ** 2;
        sxy += (x[i] - mx) * (y[i] - my);
      }
      // Smallest eigenvalue of the 2×2 scatter matrix = orthogonal RSS of the best line.
      const tr = sxx + syy;
      const det = sxx * syy - sxy * sxy;
      return tr / 2 - Math.sqrt(Math.max(0, (tr * tr) / 4 - det));
    };
    const total = tls(left) + tls(right);
    if (total < best) {
      best = total;
      bestK = k;
    }
  }
  return bestK;
}

type Variant = (p: Pts, t0: number, m: number) => number | null;

function adjusted(p: Pts, x: number[]) {
  const r = p.vo2.map((v, i) => v - x[i]);
  return { co2: withoutBreathScatter(p.vco2, p.smCo2, r), ve: withoutBreathScatter(p.ve, p.smVe, r) };
}

function sharedVariant(x: number[] | null, p: Pts, m: number, adjust = true): number | null {
  if (!x) return null;
  const { co2, ve } = adjust ? adjusted(p, x) : { co2: p.vco2, ve: p.ve };
  const fit = sharedKnotFit(x, [co2, ve], m);
  if (!fit) return null;
  const [c, v] = fit.lines;
  if (vslopeSlopeReason(c.slopeBefore, c.slopeAfter)) return null;
  if (!(v.slopeAfter > v.slopeBefore)) return null;
  return fit.knot;
}

function hingeVariant(x: number[] | null, p: Pts, m: number, adjust: boolean): number | null {
  if (!x) return null;
  const y = adjust ? adjusted(p, x).co2 : p.vco2;
  const fit = hingeFit(preparePoints(x, y), m);
  if (!fit || vslopeSlopeReason(fit.slopeBefore, fit.slopeAfter)) return null;
  return fit.knot;
}

const VARIANTS: Record<string, Variant> = {
  'vslope-ve x recomputed': (p, _t0, m) => sharedVariant(p.smVo2, p, m),
  'kin-ve lin': (p, t0, m) => sharedVariant(kineticVo2(p, t0, false), p, m),
  'kin-ve quad': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true), p, m),
  'kin-ve quad tau20': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true, 20), p, m),
  'kin-ve quad tau30': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true, 30), p, m),
  'kin-ve quad tau40': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true, 40), p, m),
  'kin-ve quad tau50': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true, 50), p, m),
  'kin-ve quad tau60': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true, 60), p, m),
  'kin-ve quad tau30 lag': (p, t0, m) => laggedVariant(p, t0, m, 30),
  'kin-ve lin tau40': (p, t0, m) => sharedVariant(kineticVo2(p, t0, false, 40), p, m),
  'kin-hinge quad tau40 adj': (p, t0, m) => hingeVariant(kineticVo2(p, t0, true, 40), p, m, true),
  'kin-ve quad noadj': (p, t0, m) => sharedVariant(kineticVo2(p, t0, true), p, m, false),
  'kin-hinge quad': (p, t0, m) => hingeVariant(kineticVo2(p, t0, true), p, m, false),
  'kin-hinge quad adj': (p, t0, m) => hingeVariant(kineticVo2(p, t0, true), p, m, true),
  'deming raw': (p, _t0, m) => demingHinge(p.vo2, p.vco2, m),
};

const k = Number(process.argv[2] ?? 5);
const families = (process.argv[3] ?? '1,B').split(',');
const firstSeeds = (process.argv[4] ?? String(DEVELOPMENT_FIRST_SEED)).split(',').map(Number);
// The widest a run reaches: the hard grid's offset plus 24 cells (family 1) or k × 12 draws (family B) per first seed.
for (const first of firstSeeds) {
  const problem = developmentSeedProblem(first, HARD_SEED_OFFSET + 24 * k);
  if (problem) throw new Error(`development seeds only: ${problem}`);
}
const ONLY = process.env.ONLY ? process.env.ONLY.split(',') : null;
if (ONLY) for (const key of Object.keys(VARIANTS)) if (!ONLY.includes(key)) delete VARIANTS[key];

const HARD = process.env.HARD === '1';

function familyBMain(count: number, first: number): TruthCase[] {
  const condition = HARD ? 'short-or-noisy' : 'main';
  return kineticCases(condition, count, first).map((c) => familyBCase(c, condition));
}
const pct = (found: number | null | undefined, truth: number) => (found === null || found === undefined ? null : (100 * (found - truth)) / truth);

for (const fam of families) {
  const cases: TruthCase[] = firstSeeds.flatMap((first) => (fam === '1' ? family1((HARD ? hardCases : mainCases)(k, first)) : familyBMain(k * 12, first)));
  const t0clock = Date.now();
  const rows: { release: number; methods: Record<string, number | null> }[] = [];
  for (const c of cases) {
    const { table, vt1 } = c.generate();
    const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
    const methods: Record<string, number | null> = {};
    for (const mo of a.vt1.methods) methods[mo.method] = mo.found ? pct(mo.vo2MlMin, vt1.vo2MlMin) : null;
    const inc: [number, number] = [a.phases.incrementalStartS, a.phases.incrementalEndS];
    const prelim = estimateThreshold('vt2', VT2_METHODS, { series: a.series, fromS: inc[0], toS: inc[1], settings: DEFAULT_SETTINGS }, inc, false);
    const bound = vt2Bound(prelim, inc[1]);
    const w = vt1Window(a.series, a.phases, bound ?? inc[1]);
    const p = windowPts(w.series, w.fromS, w.toS);
    const m = minPerSide(DEFAULT_SETTINGS, p.t.length);
    for (const [name, f] of Object.entries(VARIANTS)) methods[name] = pct(f(p, inc[0], m), vt1.vo2MlMin);
    rows.push({ release: pct(a.vt1.at?.vo2MlMin, vt1.vo2MlMin) ?? 100, methods });
  }
  console.log(`\n## family ${fam} ${HARD ? 'short-or-noisy' : 'main'}, development (${cases.length} tests, ${((Date.now() - t0clock) / 1000).toFixed(0)} s)\n`);
  const names = Object.keys(rows[0].methods);
  console.log('| method | found | bias % | spread % | median abs % | p95 abs % |\n| --- | --- | --- | --- | --- | --- |');
  for (const nm of names) {
    const v = rows.map((r) => r.methods[nm]).filter((x): x is number => x !== null);
    const abs = v.map(Math.abs);
    console.log(`| ${nm} | ${v.length} | ${median(v).toFixed(1)} | ${((quantile(v, 0.75) - quantile(v, 0.25)) / 1.349).toFixed(1)} | ${median(abs).toFixed(1)} | ${quantile(abs, 0.95).toFixed(1)} |`);
  }
  const others = ['vslope', 've-vo2', 'excess-co2', 'peto2'];
  const consensus = (lead: string[], checks: string[]) =>
    rows.map((r) => {
      const l = lead.map((x) => r.methods[x]).filter((x): x is number => x !== null && x !== undefined);
      const all = [...lead, ...checks].map((x) => r.methods[x]).filter((x): x is number => x !== null && x !== undefined);
      if (!all.length) return 100;
      const ma = median(all);
      // Errors are % of the same truth, so the 10 % guard is applied on (100 + error).
      if (l.length && Math.abs(median(l) - ma) <= 0.1 * (100 + ma)) return median(l);
      return ma;
    });
  const show = (name: string, e: number[]) => {
    const abs = e.map(Math.abs);
    console.log(`| ${name} | ${median(abs).toFixed(1)} | ${quantile(abs, 0.95).toFixed(1)} | ${median(e).toFixed(1)} |`);
  };
  console.log('\n| consensus | VT1 median % | p95 % | bias % |\n| --- | --- | --- | --- |');
  show('release as analysed', rows.map((r) => r.release));
  show('release recomputed (vslope-ve + vslope-hinge)', consensus(['vslope-ve', 'vslope-hinge'], others));
  for (const nm of names.filter((x) => (x.startsWith('kin') || x.startsWith('deming')) && (!process.env.PAIRS || x.includes(process.env.PAIRS)))) {
    show(`${nm} + vslope-hinge`, consensus([nm, 'vslope-hinge'], ['vslope-ve', ...others]));
    show(`vslope-ve + ${nm}`, consensus(['vslope-ve', nm], ['vslope-hinge', ...others]));
    show(`${nm} alone`, consensus([nm], ['vslope-ve', 'vslope-hinge', ...others]));
  }
  if (rows[0].methods['kin-ve quad tau40'] !== undefined) {
    show('kin-ve quad tau40 + vslope-hinge, vslope-ve not a check', consensus(['kin-ve quad tau40', 'vslope-hinge'], others));
    show('vslope-ve + vslope-hinge + kin-ve quad tau40', consensus(['vslope-ve', 'vslope-hinge', 'kin-ve quad tau40'], others));
  }
}
