// The workbench's number-format setting reaches the report: a preview asked in fr-FR prints
// decimal commas and day/month/year dates (read with poppler's pdftotext), and the case
// records the locale. Reference: core/locale/locales.ts (fr-FR: decimal comma, dd/mm/yyyy).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { dispatch } from '../../../host/workbench/api';
import { openDemoCase } from './demo-case';
import { createWiredService } from '../../../host/workbench/wiring';


describe('workbench report locale', () => {
  it('a preview in fr-FR prints French number and date formats', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'twofold-wb-locale-'));
    const service = createWiredService({ dataDir });
    const caseId = await openDemoCase(service);
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
