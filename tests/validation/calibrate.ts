/**
 * Calibration of the threshold interval on development seeds only: for scales a (bootstrap SD),
 * b (between-method SD) and a floor f (% of the consensus VO2), the coverage of
 * consensus ± 1.96·√((a·s_boot)² + (b·s_methods)² + (f·VO2)²) per family and condition.
 * Run: npx tsx tests/validation/calibrate.ts [seedsPerCell] [families, e.g. 1,B]
 * The released weights come from the likelihood fit instead (interval-dump.ts, then
 * calibration/fit-interval.py); this grid search stays as a check of any candidate weights.
 */
import { DEVELOPMENT_FIRST_SEED, hardCases, mainCases } from './cases';
import { family1, measureAll, type CaseResult, type TruthCase } from './measure';
import { familyBCases } from './family-b';

const k = Number(process.argv[2] ?? 2);
const fams = (process.argv[3] ?? '1,B').split(',');
const sets: [string, TruthCase[]][] = [];
if (fams.includes('1')) sets.push(['f1 main', family1(mainCases(k, DEVELOPMENT_FIRST_SEED))], ['f1 hard', family1(hardCases(k, DEVELOPMENT_FIRST_SEED))]);
const b = fams.includes('B') ? familyBCases('development', k * 12) : null;
if (b) sets.push(['B main', b.filter((c) => c.condition === 'main')], ['B hard', b.filter((c) => c.condition === 'hard')]);
const results: [string, CaseResult[]][] = sets.map(([n, c]) => [n, measureAll(c, true)]);
const grid = (name: string, d: string) => (process.env[name] ?? d).split(',').map(Number);
const as = grid('AS', '0.5,1,1.5,2');
const bs = grid('BS', '0.5,0.75,1,1.25');
const fs = grid('FS', '0,1,2,3');
for (const id of ['vt1', 'vt2'] as const) {
  console.log(`\n${id}: coverage % per set`);
  console.log(['a', 'b', 'f%', ...results.map(([n]) => n), 'median width %'].join('\t'));
  for (const a of as) for (const bb of bs) for (const f of fs) {
    const cells: string[] = [];
    const widths: number[] = [];
    for (const [, rs] of results) {
      const cal = rs.map((r) => (id === 'vt1' ? r.vt1Calib : r.vt2Calib)).filter((x) => x !== null && x.parts !== null);
      let inside = 0;
      for (const x of cal) {
        const p = x!.parts!;
        const half = 1.96 * Math.sqrt((a * p.bootSdMlMin) ** 2 + (bb * p.methodSdMlMin) ** 2 + ((f / 100) * x!.vo2MlMin) ** 2);
        if (Math.abs(x!.errMlMin) <= half) inside++;
        widths.push((200 * half) / x!.vo2MlMin);
      }
      cells.push(((100 * inside) / cal.length).toFixed(1));
    }
    widths.sort((p, q) => p - q);
    console.log([a, bb, f, ...cells, widths[Math.floor(widths.length / 2)].toFixed(1)].join('\t'));
  }
}
