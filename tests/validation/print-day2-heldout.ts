/**
 * Prints the day-2 verdict figures on the held-out pairs of day2-verdicts.test.ts (family A
 * null 20001–, decline 30001–; family B null 40001–, decline 45001–), per outcome, for
 * docs/validation.md. Measure once; never tune on these.
 * Run: npx tsx tests/validation/print-day2-heldout.ts
 */
import { figures, runPairs, runPairsB, type PairFigures } from './day2-pairs';

const show = (name: string, f: PairFigures, skipped: number) =>
  console.log(
    `${name} (${f.n}, skipped ${skipped}): any primary lower ${f.anyPrimaryFellPct.toFixed(1)} %, VT1 lower ${f.vt1FellPct.toFixed(1)} %, peak lower ${f.peakFellPct.toFixed(1)} %, any primary higher ${f.anyPrimaryRosePct.toFixed(1)} %; per outcome ${JSON.stringify(f.calls)}`,
  );
for (const [name, run] of [
  ['A null', runPairs('null', 200, 20001)],
  ['A decline', runPairs('decline', 200, 30001)],
  ['B null', runPairsB('null', 200, 40001)],
  ['B decline', runPairsB('decline', 200, 45001)],
] as const) show(name, figures(run.results), run.skipped);
