/**
 * Family B (the second, independently built generator family) as truth cases for measure.ts.
 * Returns null until that family is on this branch.
 */
import type { TruthCase } from './measure';

export function familyBCases(_set: 'development' | 'validation', _seedsPerCell: number): TruthCase[] | null {
  return null;
}
