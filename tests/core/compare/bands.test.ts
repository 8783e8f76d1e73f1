// Checks the default band table against Decato et al., Med Sci Sports Exerc 2018;50:589–95
// (within-subject CVs) and the MDC95 factor 1.96·√2 (Weir 2005; Hopkins 2000).
import { describe, expect, it } from 'vitest';
import { bandFor, bandHalfWidthPct, DEFAULT_BAND_TABLE, MDC95_FACTOR } from '../../../core/compare/bands';
import { METRIC_IDS } from '../../../core/compare/metric-catalog';
import type { BandTable } from '../../../core/compare/types';

describe('default band table', () => {
  it('carries the published within-subject CVs (Decato et al. 2018, abstract)', () => {
    expect(DEFAULT_BAND_TABLE.entries.peak_vo2?.cvPct).toBe(4.9);
    expect(DEFAULT_BAND_TABLE.entries.vt1_vo2?.cvPct).toBe(10.4);
    expect(DEFAULT_BAND_TABLE.entries.peak_o2_pulse?.cvPct).toBe(4.6);
    expect(DEFAULT_BAND_TABLE.entries.peak_ve?.cvPct).toBe(7.4);
    expect(DEFAULT_BAND_TABLE.entries.vt1_ve_vco2?.cvPct).toBe(4.0);
    expect(DEFAULT_BAND_TABLE.entries.vt1_ve_vo2?.cvPct).toBe(4.8);
    expect(DEFAULT_BAND_TABLE.entries.peak_vo2?.source).toMatch(/Decato/);
  });

  it('gives every metric a band with a stated source; unpublished ones are about 8% (common practice)', () => {
    for (const id of METRIC_IDS) {
      const entry = DEFAULT_BAND_TABLE.entries[id];
      expect(entry, id).toBeDefined();
      expect(entry!.source.length).toBeGreaterThan(10);
    }
    expect(DEFAULT_BAND_TABLE.entries.vt1_work?.cvPct).toBe(8);
    expect(DEFAULT_BAND_TABLE.entries.vt1_work?.source).toMatch(/common practice/);
  });
});

describe('band kinds', () => {
  it('MDC95 factor is 1.96·√2 = 2.7719 (Weir 2005: SEM 1.0 → MDC95 2.77)', () => {
    expect(MDC95_FACTOR).toBeCloseTo(2.7719, 4);
  });

  it('typical = ± CV; mdc95 = 2.77 × CV: 10.4% → 28.83% (10.4 × 2.7719 = 28.828, by hand)', () => {
    expect(bandHalfWidthPct(10.4, 'typical')).toBe(10.4);
    expect(bandHalfWidthPct(10.4, 'mdc95')).toBeCloseTo(28.828, 2);
    expect(bandHalfWidthPct(4.9, 'mdc95')).toBeCloseTo(13.582, 2); // 4.9 × 2.7719 = 13.582
  });

  it("uses the lab's entry and falls back to the default, saying so in the source", () => {
    const lab: BandTable = { origin: 'lab-stated', description: 'lab', entries: { peak_vo2: { cvPct: 6, source: 'our 2025 audit' } } };
    const own = bandFor('peak_vo2', 'typical', lab)!;
    expect(own).toMatchObject({ cvPct: 6, halfWidthPct: 6, origin: 'lab-stated', source: 'our 2025 audit' });
    const fallback = bandFor('vt1_vo2', 'mdc95', lab)!;
    expect(fallback.origin).toBe('default');
    expect(fallback.cvPct).toBe(10.4);
    expect(fallback.source).toMatch(/not in the lab's band/);
  });
});
