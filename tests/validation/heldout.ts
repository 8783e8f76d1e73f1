/**
 * The held-out sets of the validation, the same for the test (accuracy.test.ts) and the printed
 * tables (npx tsx tests/validation/heldout.ts): family 1 main 72 and hard 72 tests (cases.ts),
 * family B main 72 and short-or-noisy 72 (family-b.ts). Never tune on these.
 */
import { hardCases, mainCases, VALIDATION_FIRST_SEED } from './cases';
import { familyBCases } from './family-b';
import { family1, type TruthCase } from './measure';

export const HELD_OUT_PER_SET = 72;

export function heldOutSets(): { name: string; family: string; condition: 'main' | 'hard'; cases: TruthCase[] }[] {
  const b = familyBCases('validation', HELD_OUT_PER_SET);
  return [
    { name: 'family 1, main', family: 'family 1', condition: 'main', cases: family1(mainCases(HELD_OUT_PER_SET / 12, VALIDATION_FIRST_SEED)) },
    { name: 'family 1, hard', family: 'family 1', condition: 'hard', cases: family1(hardCases(HELD_OUT_PER_SET / 24, VALIDATION_FIRST_SEED)) },
    { name: 'family B, main', family: 'family B', condition: 'main', cases: b.filter((c) => c.condition === 'main') },
    { name: 'family B, hard', family: 'family B', condition: 'hard', cases: b.filter((c) => c.condition === 'hard') },
  ];
}
