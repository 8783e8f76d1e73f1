// The workbench's number-format setting reaches the report: a preview asked in fr-FR prints
// decimal commas and day/month/year dates (read with poppler's pdftotext), and the case
// records the locale. Reference: core/locale/locales.ts (fr-FR: decimal comma, dd/mm/yyyy).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { dispatch } from '../../../host/workbench/api';
import { createWiredService } from '../../../host/workbench/wiring';

const none = { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null };

describe('workbench report locale', () => {
  it('a preview in fr-FR prints French number and date formats', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'twofold-wb-locale-'));
    const service = createWiredService({ dataDir });
    const demo = await dispatch(service, 'demoPair', {});
    if (!demo.ok) throw new Error(demo.error.message);
    const pair = demo.value as { day1: unknown; day2: unknown; title: string };
    const created = await dispatch(service, 'createCase', { title: pair.title, day1: pair.day1, day2: pair.day2, clinical: { day1: none, day2: none } });
    if (!created.ok) throw new Error(created.error.message);
    const caseId = (created.value as { caseId: string }).caseId;
    const preview = await dispatch(service, 'previewReport', { caseId, reviewer: '', locale: 'fr-FR' });
    if (!preview.ok) throw new Error(preview.error.message);
    const pdf = join(dataDir, 'preview.pdf');
    writeFileSync(pdf, Buffer.from((preview.value as { base64: string }).base64, 'base64'));
    const text = spawnSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).stdout;
    expect(text).toMatch(/Interval\s+24,3 h/);
    expect(text).toMatch(/Day 1 start\s+09\/03\/2026 09:10 \(UTC\+01:00\)/);
    const opened = await dispatch(service, 'openCase', { caseId });
    if (!opened.ok) throw new Error(opened.error.message);
    expect(JSON.parse((opened.value as { caseJson: string }).caseJson).reportLocale).toBe('fr-FR');
  });
});
