/**
 * The interval's coverage on the large held-out sets (coverage-sets.ts: 504 tests per family ×
 * condition, seeds 200001–201504, never used for tuning): coverage of VT1 and VT2 with its
 * Wilson 95 % interval, and the median width, per cell. Run once per release:
 *   npx tsx tests/validation/coverage-large.ts
 * (the nightly assertion of 93–97 % per cell is `npm run validate:coverage`, which prints the
 * same table).
 */
import { coverageReport, measureCoverageSets } from './coverage-sets';

const t0 = Date.now();
console.log(coverageReport(measureCoverageSets()));
console.log(`\ntotal ${((Date.now() - t0) / 1000).toFixed(0)} s`);
