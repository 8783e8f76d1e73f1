// Settings files: a JSON partial merged over DEFAULT_SETTINGS and validated (common practice
// for layered configuration); errors located by file, line and column.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { settingsFromJson } from '../../../core/analyze/settings-input';

describe('settingsFromJson', () => {
  it('merges a partial over the defaults', () => {
    const r = settingsFromJson('{"peaks": {"windowS": 20}, "effort": {"rerMin": 1.15}}', 'lab.json');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.peaks.windowS).toBe(20);
    expect(r.value.effort.rerMin).toBe(1.15);
    expect(r.value.effort.rpeMin).toBe(DEFAULT_SETTINGS.effort.rpeMin);
    expect(r.value.clean).toEqual(DEFAULT_SETTINGS.clean);
  });

  it('replaces a kind-tagged object whole', () => {
    const r = settingsFromJson('{"clean": {"averaging": {"kind": "time-bins", "binS": 10}}}', 'lab.json');
    expect(r.ok && r.value.clean.averaging).toEqual({ kind: 'time-bins', binS: 10 });
  });

  it('names the bad setting', () => {
    const r = settingsFromJson('{"peaks": {"windowS": -5}}', 'lab.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.file).toBe('lab.json');
    expect(r.error.message).toContain("'peaks.windowS'");
  });

  it('rejects an unknown key', () => {
    const r = settingsFromJson('{"peaks": {"windowSeconds": 30}}', 'lab.json');
    expect(r.ok).toBe(false);
  });

  it('locates a JSON syntax error', () => {
    // The stray comma sits on line 3; the parser reports the '}' after it at column 1.
    const r = settingsFromJson('{\n  "peaks": {"windowS": 30},\n}', 'lab.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.line).toBe(3);
    expect(r.error.column).toBe(1);
  });
});
