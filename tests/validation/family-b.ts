/**
 * Family B (sample-tests/kinetic-family, the second, independently built generator) as truth
 * cases for measure.ts. Its own grid and seeds: 'main' (8–12 min) and 'short-or-noisy' (our
 * 'hard': 5–8 min, or noise ×1.5–2); held-out seeds from FAMILY_B_VALIDATION_FIRST_SEED,
 * development seeds from FAMILY_B_DEVELOPMENT_FIRST_SEED. The model and the grid are that
 * family's own; nothing here changes them.
 */
import {
  FAMILY_B_DEVELOPMENT_FIRST_SEED,
  FAMILY_B_VALIDATION_FIRST_SEED,
  generateKineticTest,
  kineticCases,
} from '../../sample-tests/kinetic-family';
import type { TruthCase } from './measure';

type KineticCase = ReturnType<typeof kineticCases>[number];

/** One family-B case as a truth case of the given condition. */
export function familyBCase(c: KineticCase, condition: 'main' | 'short-or-noisy'): TruthCase {
  return {
    family: 'family B',
    condition: condition === 'main' ? 'main' : 'hard',
    hardKind: condition === 'main' ? null : c.incrementalMin < 8 ? 'short ramp' : 'very noisy',
    protocol: c.modality,
    modality: c.modality,
    noiseScale: c.noiseScale,
    outliers: c.params.outlierCount,
    seed: c.seed,
    label: c.label,
    generate: () => {
      const { table, truth } = generateKineticTest(c.params, c.seed);
      return { table, vt1: truth.vt1, vt2: truth.vt2 };
    },
  };
}

/** `count` cases of each condition. */
export function familyBCases(set: 'development' | 'validation', count: number): TruthCase[] {
  const first = set === 'development' ? FAMILY_B_DEVELOPMENT_FIRST_SEED : FAMILY_B_VALIDATION_FIRST_SEED;
  return (['main', 'short-or-noisy'] as const).flatMap((condition) => kineticCases(condition, count, first).map((c) => familyBCase(c, condition)));
}
