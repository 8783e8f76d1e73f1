/**
 * Development data for the peak's measurement SD: per day of each development pair, the
 * found peak VO2 against the model's noise-free peak, and the SD measurement.ts gives it.
 * Run: npx tsx tests/validation/peak-dump.ts [pairs] > peaks.jsonl
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { measurementSd } from '../../core/compare/measurement';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { generateTest } from '../../sample-tests/generator';
import { generateKineticTest } from '../../sample-tests/kinetic-family';
import { pairParams, pairParamsB } from './day2-pairs';

const n = Number(process.argv[2] ?? 100);
for (const kind of ['null', 'decline'] as const) {
  for (const fam of ['A', 'B'] as const) {
    let done = 0;
    for (let seed = (fam === 'A' ? 9000 : 49000) + (kind === 'null' ? 0 : 300); done < n; seed++) {
      try {
        const days = fam === 'A' ? pairParams(seed, kind).map((p, i) => generateTest(p, 2 * seed + i)) : pairParamsB(seed, kind).map((p, i) => generateKineticTest(p, 2 * seed + i));
        const out = days.map((g, i) => {
          const a = analyzeTest(g.table, DEFAULT_SETTINGS, noClinicalInputs());
          return { day: i + 1, tv: g.truth.peak.vo2MlMin, fv: a.peak.vo2MlMin, sd: measurementSd(a, 'peak_vo2').sd, maximal: a.effort.verdict, tw: g.truth.peak.workW, fw: a.peak.workW };
        });
        console.log(JSON.stringify({ fam, kind, seed, days: out }));
        done++;
      } catch {
        // skipped
      }
    }
  }
}
