// The report job on a case whose day-1 file needed a column map: it must recompute what the
// workbench showed. References: the original demo file read by detection alone (renaming a
// header and naming it back changes no value, see mapped-case.ts), and the demo file's own
// hr_bpm column for the peak heart rate's presence.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { withColumnMaps } from '../../core/case/new-case';
import { defaultEngine } from '../../core/case/default-engine';
import { recomputeCase } from '../../core/case/recompute';
import { recordSignOff } from '../../core/case/review';
import { loadCase, saveCase } from '../../host/case-folder';
import { recordCase, runReportJob } from '../../host/report-job';
import { day2, heartRateMap, mappedCase, original, originalCase, renamed } from './mapped-case';

const raw = { day1: renamed, day2 };
const reference = (() => {
  const r = recomputeCase(originalCase(), { day1: original, day2 }, defaultEngine);
  if (!r.ok) throw new Error(r.error.message);
  return r.value.recorded;
})();

describe('report job: a case with a recorded column map', () => {
  it('a case the workbench saved with its map reports the original file\'s numbers, and the folder keeps the map', async () => {
    // As the workbench does it: the host makes the case without a map, the worker records the
    // map it read day 1 with, autosave writes the case, and the export reloads the folder.
    const folder = mkdtempSync(join(tmpdir(), 'twofold-mapped-'));
    const made = withColumnMaps(mappedCase(null), { day1: heartRateMap, day2: null });
    if (!made.ok) throw new Error(made.error.message);
    expect(saveCase(folder, made.value, raw).ok).toBe(true);
    const loaded = loadCase(folder);
    if (!loaded.ok) throw new Error(loaded.error.message);
    expect(loaded.value.caseFile.inputs.day1.columnMap).toEqual(heartRateMap);
    const job = await runReportJob({ caseFile: loaded.value.caseFile, raw: loaded.value.raw, caseFolder: folder, outPath: join(folder, 'report.pdf'), reviewer: null, certificate: null, now: new Date('2026-03-11T10:10:00Z') });
    if (!job.ok) throw new Error(job.error.message);
    expect(job.value.outcome.recorded.digest).toBe(reference.digest);
    expect(job.value.outcome.recorded.numbers['day1.peak.hrBpm']).toBeTypeOf('number');
    expect(job.value.outcome.recorded.numbers['day1.peak.hrBpm']).toBe(reference.numbers['day1.peak.hrBpm']);
    const saved = loadCase(folder);
    expect(saved.ok && saved.value.caseFile.inputs.day1.columnMap).toEqual(heartRateMap);
    expect(saved.ok && saved.value.caseFile.recorded?.digest).toBe(reference.digest);
  }, 120_000);

  it('a reviewed case keeps reading with its map (a later recompute, as `twofold override` runs it)', () => {
    const first = recordCase(mappedCase(heartRateMap), raw);
    if (!first.ok) throw new Error(first.error.message);
    const signed = recordSignOff(first.value.caseFile, { who: 'T. Tester', role: 'reviewer', at: '2026-03-11T10:20:00Z' }, 'Reviewed; thresholds accepted as shown.', 'checked');
    if (!signed.ok) throw new Error(signed.error.message);
    const again = recordCase(signed.value, raw);
    expect(again.ok && again.value.outcome.recorded.digest).toBe(reference.digest);
  }, 120_000);

  it('without the map the same bytes give other numbers: day 1 has no heart rate', () => {
    const plain = recordCase(mappedCase(null), raw);
    if (!plain.ok) throw new Error(plain.error.message);
    expect(plain.value.outcome.recorded.numbers['day1.peak.hrBpm']).toBeNull();
    expect(plain.value.outcome.recorded.digest).not.toBe(reference.digest);
  }, 120_000);
});
