// The batch results CSV (our own layout): one row per pair, compared or skipped; columns
// counted by hand: 8 fixed + 4 per metric.
import { describe, expect, it } from 'vitest';
import { compareTests } from '../../../core/compare/compare-tests';
import { METRIC_IDS } from '../../../core/compare/metric-catalog';
import { resultsHeader, resultsRow } from '../../../core/compare/results-csv';
import { locatedError } from '../../../core/model/errors';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { buildAnalysis } from './fixture';

describe('results CSV', () => {
  const columns = resultsHeader().split(',');
  it('has 8 + 4 × metrics columns', () => {
    expect(columns.length).toBe(8 + 4 * METRIC_IDS.length);
    expect(columns.slice(0, 3)).toEqual(['pair_id', 'status', 'error']);
  });

  it('writes a compared row with its numbers and a skipped row with its located error', () => {
    const c = compareTests(buildAnalysis({ vt1: { vo2MlMin: 1500 } }), buildAnalysis({ metadata: { testStart: '2026-03-03T09:00:00Z' }, vt1: { vo2MlMin: 1200 } }), DEFAULT_SETTINGS);
    const row = resultsRow({ pairId: 'P1', status: 'compared', comparison: c }).split(',');
    expect(row.length).toBe(columns.length);
    expect(row[columns.indexOf('vt1_vo2_delta_pct')]).toBe('-20'); // (1200 − 1500)/1500
    expect(row[columns.indexOf('vt1_vo2_verdict')]).toBe('fell'); // −20 % below the 24-h band edge −14.9 % (CV 6 %)
    expect(row[columns.indexOf('interval_h')]).toBe('24');
    const skipped = resultsRow({ pairId: 'P2', status: 'skipped', error: locatedError('x', 'd1.csv', 4, 2, 'Bad number') });
    expect(skipped).toBe(`P2,skipped,d1.csv:4:2: Bad number${','.repeat(columns.length - 3)}`);
  });
});
