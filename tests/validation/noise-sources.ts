/**
 * Development only: which part of family B's noise the VT1 error comes from. The same
 * development subjects (main grid) are generated with every noise term as the family states it,
 * with none, and with one group of terms switched off, without outlier breaths; each row is the
 * consensus VT1 error and the two leading methods' bias.
 * Run: npx tsx tests/validation/noise-sources.ts [count=60]
 * The generator is not changed: only the documented noise parameters of each case are set.
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { median, quantile } from '../../core/math/stats';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { FAMILY_B_DEVELOPMENT_FIRST_SEED, generateKineticTest, kineticCases, type KineticNoise } from '../../sample-tests/kinetic-family';

const count = Number(process.argv[2] ?? 60);
const variants: [string, (n: KineticNoise) => KineticNoise][] = [
  ['all noise as stated', (n) => n],
  ['no noise at all', (n) => ({ ...n, scale: 0 })],
  ['without the shared breath-size factor', (n) => ({ ...n, breathSizeSd: 0 })],
  ['without sensor drift', (n) => ({ ...n, flowDriftAmp: 0, o2DriftAmp: 0 })],
  ['without independent VO2, VCO2, VE noise', (n) => ({ ...n, vo2SdMlMin: 0, vco2SdMlMin: 0, veRelSd: 0 })],
];
const pct = (found: number | null | undefined, truth: number) => (found === null || found === undefined ? 100 : (100 * (found - truth)) / truth);
for (const [name, change] of variants) {
  const cons: number[] = [];
  const lead: Record<string, number[]> = { 'vslope-ve': [], 'vslope-hinge': [] };
  for (const c of kineticCases('main', count, FAMILY_B_DEVELOPMENT_FIRST_SEED)) {
    const params = { ...c.params, noise: change(c.params.noise), outlierCount: 0 };
    const { table, truth } = generateKineticTest(params, c.seed);
    const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
    cons.push(pct(a.vt1.at?.vo2MlMin, truth.vt1.vo2MlMin));
    for (const m of a.vt1.methods) if (m.found && lead[m.method]) lead[m.method].push(pct(m.vo2MlMin, truth.vt1.vo2MlMin));
  }
  const abs = cons.map(Math.abs);
  const leads = Object.entries(lead).map(([m, e]) => `${m} bias ${median(e).toFixed(1)} (found ${e.length})`).join(', ');
  console.log(`${name.padEnd(42)} VT1 median ${median(abs).toFixed(1)} p95 ${quantile(abs, 0.95).toFixed(1)} bias ${median(cons).toFixed(1)}; ${leads}`);
}

// Where the leading methods' bias depends on where VT1 lies in the VT1 search window (VO2 at
// VT1 as a fraction of the window's VO2 range, terciles of the development tests, noise as
// stated, outliers as drawn): a pull towards the window's middle shows as late estimates when
// VT1 lies low in the window and early ones when it lies high.
const rows: { f: number; ve: number; hinge: number }[] = [];
for (const c of kineticCases('main', 2 * count, FAMILY_B_DEVELOPMENT_FIRST_SEED)) {
  const { table, truth } = generateKineticTest(c.params, c.seed);
  const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
  const ve = a.vt1.methods.find((m) => m.method === 'vslope-ve');
  const hinge = a.vt1.methods.find((m) => m.method === 'vslope-hinge');
  if (!ve?.found || !ve.evidence || !hinge?.found) continue;
  const [x0, x1] = ve.evidence.window;
  rows.push({ f: (truth.vt1.vo2MlMin - x0) / (x1 - x0), ve: pct(ve.vo2MlMin, truth.vt1.vo2MlMin), hinge: pct(hinge.vo2MlMin, truth.vt1.vo2MlMin) });
}
rows.sort((p, q) => p.f - q.f);
const third = Math.ceil(rows.length / 3);
for (let i = 0; i < 3; i++) {
  const part = rows.slice(i * third, (i + 1) * third);
  if (!part.length) continue;
  console.log(
    `VT1 at ${part[0].f.toFixed(2)}–${part[part.length - 1].f.toFixed(2)} of the window (n ${part.length}): vslope-ve bias ${median(part.map((r) => r.ve)).toFixed(1)}, vslope-hinge bias ${median(part.map((r) => r.hinge)).toFixed(1)}`,
  );
}
