/** Prints the held-out tables for docs/validation.md. Run once per release: npx tsx tests/validation/print-heldout.ts */
import { heldOutSets } from './heldout';
import { byCondition, measureAll, methodTable, summarise, SUMMARY_HEADER, summaryRow } from './measure';

for (const set of heldOutSets()) {
  const t0 = Date.now();
  const rs = measureAll(set.cases);
  console.log(`\n### ${set.name} (${rs.length} held-out tests, ${((Date.now() - t0) / 1000).toFixed(0)} s)\n`);
  console.log(SUMMARY_HEADER);
  console.log(summaryRow('all', summarise(rs)));
  for (const [k, s] of byCondition(rs, (c) => c.protocol)) console.log(summaryRow(k, s));
  if (set.condition === 'hard') for (const [k, s] of byCondition(rs, (c) => c.hardKind ?? '')) console.log(summaryRow(k, s));
  for (const [k, s] of byCondition(rs, (c) => `noise ×${c.noiseScale.toFixed(1)}`)) if (set.family === 'family 1') console.log(summaryRow(k, s));
  console.log('');
  console.log(methodTable(rs));
}
