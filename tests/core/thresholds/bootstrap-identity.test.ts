// The bootstrap's shared scratch arrays change how memory is used, not a single number: whole
// analyses (bootstrap on, default settings) of generated tests hash to the SHA-256 they had
// with the per-method arrays of commit e288bb1 (recorded from that commit's code).
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { analyzeTest, noClinicalInputs } from '../../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { denseTable } from '../../../bench/scaling';
import { analysisDigest } from './bootstrap-digest';

const BEFORE: Record<string, string> = {
  '11/10': '7bbe0372a66c620fb364ced66138f5c842476d4f0e0d791bb9b07adbf79340f2',
  '12/25': 'fed31f940e3467ac99f0121dd672193da74963d9e7beaa5ebd0928c0128868f2',
  '13/30': '1f0e81254fd1bdc83525c124c1e2845b4966d39449bf3b4e8515b56594c4b70e',
  '14/15': '15f85d4c6a61a9d30b63388088861ecffce44b2bcba411f9b1d818cc41aba9cb',
};

describe('bootstrap with shared scratch arrays', () => {
  for (const [key, digest] of Object.entries(BEFORE)) {
    const [seed, ramp] = key.split('/').map(Number);
    it(`gives the same analysis as before (seed ${seed}, ${ramp} W/min)`, () => {
      expect(analysisDigest(seed, ramp)).toBe(digest);
    });
  }
  it('gives the same analysis as before on a test breathed 4 times as densely (windows of different sizes)', () => {
    const result = analyzeTest(denseTable(4), DEFAULT_SETTINGS, noClinicalInputs());
    // The bootstrap ran: both thresholds carry an interval.
    expect(result.vt1.ci95Vo2MlMin).not.toBeNull();
    expect(result.vt2.ci95Vo2MlMin).not.toBeNull();
    expect(createHash('sha256').update(JSON.stringify(result)).digest('hex')).toBe('2b47c9cef389496d57030e1d1d749b49b08548691e6e3881ae5519a933fb31fc');
  });
});
