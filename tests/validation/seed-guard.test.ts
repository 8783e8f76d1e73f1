// The guard that keeps development runs off held-out seeds (tests/validation/coverage-sets.ts
// developmentSeedProblem): the held-out grids below 5000 and the coverage sets 200001–201504
// are refused, development ranges beside them are not.
import { describe, expect, it } from 'vitest';
import { DEVELOPMENT_FIRST_SEED } from './cases';
import { COVERAGE_FIRST_SEED, COVERAGE_LAST_SEED, developmentSeedProblem } from './coverage-sets';

describe('development seed guard', () => {
  it('refuses held-out seeds and accepts the development ranges', () => {
    expect([DEVELOPMENT_FIRST_SEED, COVERAGE_FIRST_SEED, COVERAGE_LAST_SEED]).toEqual([5000, 200001, 201504]);
    expect(developmentSeedProblem(5000, 1120)).toBeNull();
    expect(developmentSeedProblem(4999, 10)).toMatch(/held-out seed/);
    expect(developmentSeedProblem(1, 10)).toMatch(/held-out seed/);
    // A range that ends just before the coverage sets, one that reaches into them, one inside, one after.
    expect(developmentSeedProblem(199_001, 1000)).toBeNull();
    expect(developmentSeedProblem(199_002, 1000)).toMatch(/200001–201504/);
    expect(developmentSeedProblem(200_500, 10)).toMatch(/coverage sets/);
    expect(developmentSeedProblem(201_505, 1000)).toBeNull();
    expect(developmentSeedProblem(5000.5, 10)).toMatch(/whole numbers/);
  });
});
