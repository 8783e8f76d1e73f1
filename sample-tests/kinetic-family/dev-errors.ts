/**
 * Prints the analysis's VT1/VT2 errors on family B DEVELOPMENT seeds (5000 and up):
 *   npx tsx sample-tests/kinetic-family/dev-errors.ts [count=20] [firstSeed=5000]
 * It refuses held-out seeds, so exploring here never touches the validation set.
 * Error = (found − true) / true × 100, signed; a threshold not found prints NaN.
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { generateKineticTest } from './generate';
import { FAMILY_B_DEVELOPMENT_FIRST_SEED, kineticCases, type KineticCondition } from './grid';

const count = Number(process.argv[2] ?? 20);
const firstSeed = Number(process.argv[3] ?? FAMILY_B_DEVELOPMENT_FIRST_SEED);
if (firstSeed < FAMILY_B_DEVELOPMENT_FIRST_SEED) {
  throw new Error(`Seeds below ${FAMILY_B_DEVELOPMENT_FIRST_SEED} are held out for validation; use development seeds.`);
}

const pct = (found: number | null | undefined, truth: number | null) => (found == null || truth == null ? Number.NaN : (100 * (found - truth)) / truth);
const median = (xs: number[]) => {
  const s = xs.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
  if (!s.length) return Number.NaN;
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const f = (x: number) => x.toFixed(1);

for (const condition of ['main', 'short-or-noisy'] as KineticCondition[]) {
  const rows: { e1: number; e2: number; w1: number; w2: number; c1: boolean; c2: boolean }[] = [];
  for (const c of kineticCases(condition, count, firstSeed)) {
    const { table, truth } = generateKineticTest(c.params, c.seed);
    const a = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
    const inside = (ci: readonly [number, number] | null, t: number) => ci !== null && ci[0] <= t && t <= ci[1];
    const row = {
      e1: pct(a.vt1.at?.vo2MlMin, truth.vt1.vo2MlMin),
      e2: pct(a.vt2.at?.vo2MlMin, truth.vt2.vo2MlMin),
      w1: pct(a.vt1.at?.workW, truth.vt1.workW),
      w2: pct(a.vt2.at?.workW, truth.vt2.workW),
      c1: inside(a.vt1.ci95Vo2MlMin, truth.vt1.vo2MlMin),
      c2: inside(a.vt2.ci95Vo2MlMin, truth.vt2.vo2MlMin),
    };
    rows.push(row);
    console.log(`${c.seed} ${c.label}: VT1 ${f(row.e1)} %, VT2 ${f(row.e2)} %, work VT1 ${f(row.w1)} %, work VT2 ${f(row.w2)} %, CI covers ${row.c1}/${row.c2}`);
  }
  const abs = (xs: number[]) => xs.map(Math.abs);
  const e1 = rows.map((r) => r.e1);
  const e2 = rows.map((r) => r.e2);
  console.log(
    `${condition} (n ${rows.length}): VT1 median |err| ${f(median(abs(e1)))} %, signed ${f(median(e1))} %, max |err| ${f(Math.max(...abs(e1)))} %; ` +
      `VT2 median |err| ${f(median(abs(e2)))} %, signed ${f(median(e2))} %, max |err| ${f(Math.max(...abs(e2)))} %; ` +
      `work VT1 median |err| ${f(median(abs(rows.map((r) => r.w1))))} %, work VT2 ${f(median(abs(rows.map((r) => r.w2))))} %; ` +
      `CI coverage VT1 ${rows.filter((r) => r.c1).length}/${rows.length}, VT2 ${rows.filter((r) => r.c2).length}/${rows.length}`,
  );
}
