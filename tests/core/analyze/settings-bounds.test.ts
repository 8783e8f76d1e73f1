// Every setting is bounded (issue: replicates 1e9 or a 1e-9 W workload step hung analyze and
// compare; a case with 2e9 replicates hung verify). The figures asked for here are the ones
// from that report; the expected messages name the file, line and column of the key.
import { describe, expect, it } from 'vitest';
import { settingsFromJson } from '../../../core/analyze/settings-input';
import { caseFromText } from '../../../core/case/case-text';
import { formatLocated } from '../../../core/model/errors';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';

describe('settings bounds', () => {
  it('refuses a billion bootstrap replicates, naming the line and column of the key', () => {
    const text = '{\n  "thresholds": {\n    "bootstrap": { "replicates": 1e9 }\n  }\n}\n';
    const r = settingsFromJson(text, 's.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(formatLocated(r.error)).toMatch(/^s\.json:3:20: Setting 'thresholds\.bootstrap\.replicates' is not valid: .*2000/);
  });

  it.each([
    ['{"compare": {"workloadStepW": 1e-9}}', 'compare.workloadStepW'],
    ['{"peaks": {"windowS": 1e6}}', 'peaks.windowS'],
    ['{"clean": {"averaging": {"kind": "rolling-time", "windowS": 0.000001}}}', 'clean.averaging.windowS'],
    ['{"clean": {"outliers": {"kind": "local-sd", "windowBreaths": 1000000, "limitSd": 4}}}', 'clean.outliers.windowBreaths'],
    ['{"thresholds": {"minPointsPerSegment": 100000}}', 'thresholds.minPointsPerSegment'],
    ['{"compare": {"intervalHMin": 60, "intervalHMax": 30}}', 'compare.intervalHMin'],
    ['{"import": {"implausible": {"hrMinBpm": 90, "hrMaxBpm": 160, "vo2MaxMlMin": 1e300}}}', 'import.implausible.vo2MaxMlMin'],
  ])('refuses %s', (text, path) => {
    const r = settingsFromJson(text, 's.json');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toContain(`'${path}'`);
  });

  it('accepts the defaults and the edges of each range', () => {
    expect(settingsFromJson('{}', 's.json').ok).toBe(true);
    expect(settingsFromJson('{"thresholds": {"bootstrap": {"replicates": 2000, "seed": 1}}, "compare": {"workloadStepW": 1}}', 's.json').ok).toBe(true);
  });

  it('a case file whose settings ask for 2e9 replicates is refused on load, not run', () => {
    const caseFile = {
      format: 'twofold-case',
      version: 1,
      createdAt: '2026-03-11T10:00:00Z',
      inputs: {
        day1: { name: 'a.csv', sha256: 'a'.repeat(64), sizeBytes: 1, storedAs: `raw/${'a'.repeat(64)}.csv` },
        day2: { name: 'b.csv', sha256: 'b'.repeat(64), sizeBytes: 1, storedAs: `raw/${'b'.repeat(64)}.csv` },
      },
      settings: { ...DEFAULT_SETTINGS, thresholds: { ...DEFAULT_SETTINGS.thresholds, bootstrap: { replicates: 2e9, seed: 1 } } },
      clinical: { day1: { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null }, day2: { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null } },
      log: [],
      recorded: null,
    };
    const text = `${JSON.stringify(caseFile, null, 2)}\n`;
    const r = caseFromText(text, 'c.json');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.message).toContain('settings.thresholds.bootstrap.replicates');
      expect(r.error.line).toBe(text.split('\n').findIndex((l) => l.includes('"replicates"')) + 1);
    }
  });
});
