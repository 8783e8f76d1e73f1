/**
 * The worker's patch of a view against the one it posted before (renderer/src/engine/view-patch.ts):
 * applied to the page's copy it gives the new view exactly, it carries only what changed, and
 * unchanged parts keep their identity. Reference: the worked example in the module's comment,
 * structural equality (vitest's toEqual) of the result with the new value, and core's own
 * recompute of a generated pair before and after an override (the worker's engine).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyPatch, diffValue } from '../../../../renderer/src/engine/view-patch';
import { workbenchEngine } from '../../../../renderer/src/engine/core-engine';
import { noClinicalInputs } from '../../../../core/analyze/analyze-test';
import { newCase } from '../../../../core/case/new-case';
import { recomputeCase, recomputeValues } from '../../../../core/case/recompute';
import { recordOverride } from '../../../../core/case/review';
import { writeBreathCsv } from '../../../../core/export/breath-csv';
import { DEFAULT_SETTINGS } from '../../../../core/model/settings';
import { defaultCycleParams, generateTest } from '../../../../sample-tests/generator';

describe('view patches', () => {
  it('gives the worked example of the module comment', () => {
    expect(diffValue({ a: 1, b: { c: [1, 2] } }, { a: 1, b: { c: [1, 2, 3] } })).toEqual({ keys: { b: { keys: { c: { items: { 2: { set: 3 } }, length: 3 } } } } });
  });

  it('is null for the same value, and a NaN equals a NaN', () => {
    const v = { x: [1, { y: Number.NaN }] };
    expect(diffValue(v, v)).toBeNull();
    expect(diffValue(v, { x: [1, { y: Number.NaN }] })).toBeNull();
  });

  it('leaves unchanged parts as the page already has them', () => {
    const series = { timeS: [0, 1, 2], vo2MlMin: [300, 310, 320] };
    const before = { day1: { series, vt1: { vo2MlMin: 1000 } }, day2: { series: { ...series }, vt1: { vo2MlMin: 900 } }, log: [{ seq: 0 }] };
    const after = { ...before, day2: { ...before.day2, vt1: { vo2MlMin: 850 } }, log: [...before.log, { seq: 1 }] };
    const patch = diffValue(before, after);
    expect(patch).toEqual({ keys: { day2: { keys: { vt1: { keys: { vo2MlMin: { set: 850 } } } } }, log: { items: { 1: { set: { seq: 1 } } }, length: 2 } } });
    const applied = applyPatch(before, patch);
    expect(applied).toEqual(after);
    expect(applied.day1).toBe(before.day1);
    expect(applied.day2.series).toBe(before.day2.series);
    expect(applied.log[0]).toBe(before.log[0]);
  });

  it('drops keys and shortens arrays', () => {
    const before = { a: 1, b: 2, list: [1, 2, 3, 4] };
    const after = { a: 1, list: [1, 2, 3] };
    expect(applyPatch(before, diffValue(before, after))).toEqual(after);
    expect(applyPatch(before, diffValue(before, after))).not.toHaveProperty('b');
  });

  it('rebuilds any JSON-like value from any other (property check)', () => {
    const value = fc.jsonValue({ maxDepth: 4 });
    fc.assert(
      fc.property(value, value, (a, b) => {
        expect(applyPatch(a, diffValue(a, b))).toEqual(b);
      }),
      { numRuns: 300, seed: 14 },
    );
  });
});

describe('the patch the worker posts for an override', () => {
  it('carries the moved threshold, the changed comparison rows and the new log entry, not the analyses', async () => {
    const params = defaultCycleParams();
    const d1 = generateTest({ ...params, name: 'patch-day1', testStart: '2026-05-04T09:00:00Z' }, 1401);
    const d2 = generateTest({ ...params, name: 'patch-day2', testStart: '2026-05-05T09:00:00Z', vt1Vo2MlMin: 900 }, 1402);
    const raw = { day1: new TextEncoder().encode(writeBreathCsv(d1.table)), day2: new TextEncoder().encode(writeBreathCsv(d2.table)) };
    const caseFile = newCase('2026-05-05T12:00:00Z', { name: 'day1.csv', bytes: raw.day1 }, { name: 'day2.csv', bytes: raw.day2 }, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
    // The worker's engine: imports preloaded and analyses memoised, as when a case is open.
    const engine = workbenchEngine(new Map());
    await engine.preload('day1.csv', raw.day1, caseFile.settings);
    await engine.preload('day2.csv', raw.day2, caseFile.settings);
    const before = recomputeCase(caseFile, raw, engine);
    if (!before.ok) throw new Error(before.error.message);
    const moved = recordOverride(caseFile, before.value, { who: 'R', role: 'physiologist', at: '2026-05-05T12:05:00Z' }, 2, 'vt1', { timeS: d2.truth.phases.incrementalStartS + 240 }, 'test');
    if (!moved.ok) throw new Error(moved.error.message);
    const after = recomputeValues(moved.value, raw, engine);
    if (!after.ok) throw new Error(after.error.message);
    const viewOf = (v: { day1: unknown; day2: unknown; comparison: unknown }, log: unknown) => ({ day1: v.day1, day2: v.day2, comparison: v.comparison, log });
    const previous = viewOf(before.value, caseFile.log);
    const next = viewOf(after.value, moved.value.log);
    const patch = diffValue(previous, next);
    expect(applyPatch(previous, patch)).toEqual(next);
    const keys = (p: unknown): string[] => (p && typeof p === 'object' && 'keys' in p ? Object.keys((p as { keys: object }).keys) : []);
    const top = (patch as { keys: Record<string, unknown> }).keys;
    // Day 1 is untouched; on day 2 only VT1 (its values and its state) changed.
    expect(Object.keys(top).sort()).toEqual(['comparison', 'day2', 'log']);
    expect(keys(top.day2).sort()).toEqual(['analysis', 'vt1']);
    expect(keys((top.day2 as { keys: Record<string, unknown> }).keys.analysis)).toEqual(['vt1']);
    // A tenth or less of what posting the whole view would carry (both days' series and analyses).
    expect(JSON.stringify(patch).length).toBeLessThan(0.1 * JSON.stringify(next).length);
  }, 60_000);
});
