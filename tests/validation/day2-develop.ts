/**
 * Day-2 verdicts on development pairs only (family A null from 9000, decline from 9300;
 * family B null from 49000, decline from 49300), never the held-out seeds of
 * day2-verdicts.test.ts. Prints the figures of day2-pairs.ts `figures`.
 * Run: npx tsx tests/validation/day2-develop.ts [pairs per kind and family]
 */
import { figures, runPairs, runPairsB, type PairFigures } from './day2-pairs';

const n = Number(process.argv[2] ?? 40);
const show = (name: string, f: PairFigures) =>
  console.log(
    `${name} (${f.n}): any primary lower ${f.anyPrimaryFellPct.toFixed(1)} %, VT1 lower ${f.vt1FellPct.toFixed(1)} %, peak lower ${f.peakFellPct.toFixed(1)} %, any primary higher ${f.anyPrimaryRosePct.toFixed(1)} %; lower per outcome ${Object.entries(f.calls).map(([k, v]) => `${k} ${v.fell}`).join(", ")}; VT1 VO2 ${JSON.stringify(f.calls.vt1_vo2)}`,
  );
show('A null', figures(runPairs('null', n, 9000).results));
show('A decline', figures(runPairs('decline', n, 9300).results));
show('B null', figures(runPairsB('null', n, 49000).results));
show('B decline', figures(runPairsB('decline', n, 49300).results));
