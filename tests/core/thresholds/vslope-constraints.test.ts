// The V-slope constraints on the two slopes (Beaver et al., J Appl Physiol 1986, as described
// in core/thresholds/vslope-hinge.ts): below VT1 a slope near 1 (at most 1.1 accepted), above
// VT1 VCO2 rises faster than VO2 (slope above 1), and the slope rises by at least 0.1.
import { describe, expect, it } from 'vitest';
import { vslopeSlopeReason } from '../../../core/thresholds/vslope-hinge';

describe('V-slope slope constraints', () => {
  it('rejects a break whose upper slope stays below 1 (0.85 → 0.96)', () => {
    expect(vslopeSlopeReason(0.85, 0.96)).toMatch(/above the break is 0\.96/);
  });
  it('rejects a break of less than 0.1 (0.95 → 1.02)', () => {
    expect(vslopeSlopeReason(0.95, 1.02)).toMatch(/rises by only 0\.07/);
  });
  it('rejects a lower slope above 1.1', () => {
    expect(vslopeSlopeReason(1.15, 1.6)).toMatch(/below the break is 1\.15/);
  });
  it('accepts the textbook shape (0.95 → 1.4)', () => {
    expect(vslopeSlopeReason(0.95, 1.4)).toBeNull();
  });
});
