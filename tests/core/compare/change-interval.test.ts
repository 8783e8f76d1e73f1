// The finding's z (core/compare/change-interval.ts Z_FINDING), recomputed independently: for a
// standard bivariate normal with correlation ρ, P(X < −z or Y < −z) = 2Φ(−z) − P(X < −z, Y < −z),
// with P(X < −z, Y < −z) = ∫_{−∞}^{−z} φ(x) Φ((−z − ρx)/√(1 − ρ²)) dx (conditional normal;
// textbook probability), integrated here with Simpson's rule. Reference values: ρ → 1 gives the
// single-outcome 1.960 and ρ = 0 gives Šidák's 1 − (1 − p)² (both by hand).
import { describe, expect, it } from 'vitest';
import { changeCall, Z_FINDING } from '../../../core/compare/change-interval';
import { bandFor } from '../../../core/compare/bands';

/** Φ by the Abramowitz–Stegun 7.1.26 erf approximation (|error| < 1.5e-7). */
function phi(x: number): number {
  const t = 1 / (1 + (0.3275911 * Math.abs(x)) / Math.SQRT2);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erf = 1 - poly * Math.exp(-(x * x) / 2);
  return x >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

function eitherBelow(z: number, rho: number): number {
  const n = 4000;
  const lo = -10;
  const hi = -z;
  const h = (hi - lo) / n;
  const f = (x: number) => (Math.exp(-(x * x) / 2) / Math.sqrt(2 * Math.PI)) * phi((-z - rho * x) / Math.sqrt(1 - rho * rho));
  let s = f(lo) + f(hi);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(lo + i * h);
  return 2 * phi(-z) - (s * h) / 3;
}

describe('Z_FINDING', () => {
  it('gives a 2.5 % chance that either of two facets correlated by 0.8 lands below −z', () => {
    expect(eitherBelow(Z_FINDING, 0.8)).toBeCloseTo(0.025, 4);
  });
  it('lies between the single-outcome 1.960 and Bonferroni over four outcomes, 2.241', () => {
    expect(eitherBelow(1.96, 0.999999)).toBeCloseTo(0.025, 3);
    // ρ = 0: 1 − (1 − Φ(−z))², at z = 2.152: Φ(−2.152) = 0.01570 → 3.11 %
    expect(eitherBelow(Z_FINDING, 0)).toBeCloseTo(1 - (1 - phi(-Z_FINDING)) ** 2, 4);
    expect(Z_FINDING).toBeGreaterThan(1.96);
    expect(Z_FINDING).toBeLessThan(2.2414);
  });
});

describe('changeCall', () => {
  const band = bandFor('vt1_vo2'); // 24-h default, CV 6 %
  it('worked example: 1200 → 950 mL/min, s1 = s2 = 0.03, CV 6 % → lower, limit −18.1 %', () => {
    // σ = √2·ln 1.06 = 0.08240, m = 0.04243, limit exp(−2.152·√(σ² + m²)) − 1 = exp(−0.19946) − 1 = −18.08 %
    const c = changeCall(1200, 950, 0.03, 0.03, band, 'test', Z_FINDING)!;
    expect(c.interval.limitLowPct).toBeCloseTo(-18.08, 1);
    expect(c.verdict).toBe('fell');
  });
  it('a wider measurement turns the same change into undetermined, never into higher', () => {
    const c = changeCall(1200, 950, 0.12, 0.12, band, 'test', Z_FINDING)!;
    expect(c.verdict).toBe('open');
  });
});
