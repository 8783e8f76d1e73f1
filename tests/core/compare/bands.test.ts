// Checks the band presets against their sources (Decato et al., Med Sci Sports Exerc 2018 CVs,
// verified against the abstract) and the log-scale MDC95 limits exp(±1.96·√2·ln(1 + CV)) − 1
// (Hopkins 2000; Weir 2005; check-values.md: CV 10.4 % → −24.0 % / +31.6 %).
import { describe, expect, it } from 'vitest';
import { bandEdges, bandFor, bandPreset, bandStatement, CONTROLS_24H_BAND, DEFAULT_BAND_TABLE, HEALTHY_30D_BAND, MDC95_FACTOR } from '../../../core/compare/bands';
import { METRIC_IDS } from '../../../core/compare/metric-catalog';
import type { BandTable } from '../../../core/compare/types';

describe('band presets', () => {
  it('the default is the 24-h controls preset and states population, interval, statistic and source', () => {
    expect(DEFAULT_BAND_TABLE).toBe(CONTROLS_24H_BAND);
    expect(CONTROLS_24H_BAND.retestInterval).toBe('24 h');
    expect(CONTROLS_24H_BAND.population).toMatch(/sedentary or healthy control/);
    expect(CONTROLS_24H_BAND.source).toMatch(/Lien et al., Physiol Rep 2019/);
    expect(CONTROLS_24H_BAND.entries.vt1_vo2?.source).toMatch(/memory/);
    expect(bandStatement(CONTROLS_24H_BAND)).toMatch(/Population: .*Retest interval: 24 h.*Statistic: .*Source: /);
  });

  it('Decato et al. 2018 carries the published CVs and says healthy, within 30 days', () => {
    expect(HEALTHY_30D_BAND.entries.peak_vo2?.cvPct).toBe(4.9);
    expect(HEALTHY_30D_BAND.entries.vt1_vo2?.cvPct).toBe(10.4);
    expect(HEALTHY_30D_BAND.entries.peak_o2_pulse?.cvPct).toBe(4.6);
    expect(HEALTHY_30D_BAND.entries.peak_ve?.cvPct).toBe(7.4);
    expect(HEALTHY_30D_BAND.entries.vt1_ve_vco2?.cvPct).toBe(4.0);
    expect(HEALTHY_30D_BAND.retestInterval).toMatch(/30 days/);
    expect(bandPreset('healthy-30d')).toMatchObject({ ok: true });
    expect(bandPreset('typical')).toMatchObject({ ok: false });
  });

  it('gives every metric a band with a stated source', () => {
    for (const id of METRIC_IDS) expect(bandFor(id).source.length, id).toBeGreaterThan(10);
  });
});

describe('band edges on the log scale', () => {
  it('MDC95 factor is 1.96·√2 = 2.7719 (Weir 2005: SEM 1.0 → MDC95 2.77)', () => {
    expect(MDC95_FACTOR).toBeCloseTo(2.7719, 4);
  });

  it('CV 10.4 % → −24.0 % / +31.6 % (check-values.md), not ±28.8 %', () => {
    const e = bandEdges(10.4);
    expect(e.lowPct).toBeCloseTo(-23.99, 1);
    expect(e.highPct).toBeCloseTo(31.56, 1);
  });

  it('CV 6 % → −14.91 % / +17.53 % (√2·ln 1.06 = 0.08240; ×1.96 = 0.16151; by hand)', () => {
    expect(bandEdges(6).lowPct).toBeCloseTo(-14.91, 2);
    expect(bandEdges(6).highPct).toBeCloseTo(17.53, 2);
  });

  it('a stated mean day-2 change moves the centre: +5 %, CV 6 % → exp(ln 1.05 ∓ 0.16151) − 1 = −10.66 / +23.40 %', () => {
    const e = bandEdges(6, 5);
    expect(e.centrePct).toBe(5);
    expect(e.lowPct).toBeCloseTo(-10.66, 1);
    expect(e.highPct).toBeCloseTo(23.4, 1);
  });

  it("uses the lab's entry and falls back to a published value, saying so in the source", () => {
    const lab: BandTable = { origin: 'lab-stated', description: 'lab', population: 'p', retestInterval: '24 h', statistic: 's', source: 'x', entries: { peak_vo2: { cvPct: 6, source: 'our 2025 audit' } } };
    expect(bandFor('peak_vo2', lab)).toMatchObject({ cvPct: 6, origin: 'lab-stated', source: 'our 2025 audit' });
    const fallback = bandFor('vt1_ve_vco2', lab);
    expect(fallback.origin).toBe('published');
    expect(fallback.cvPct).toBe(4.0);
    expect(fallback.source).toMatch(/not in the chosen band/);
  });
});
