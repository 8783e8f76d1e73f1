/**
 * End to end in browser mode: Debian's Chromium drives the real page against the real host
 * on 127.0.0.1. References outside the page: core run directly in Node on the same files
 * (the page must show exactly those numbers, so it holds no analysis of its own), linear
 * interpolation worked by hand, the demo scenario's stated outcome (day 2 reaches VT1 at a
 * lower VO2), `twofold verify` (exit 0) and poppler's `pdfsig` as independent verdicts on the
 * signed PDF.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { newCase } from '../../core/case/new-case';
import { recomputeCase, type CaseOutcome } from '../../core/case/recompute';
import { defaultEngine } from '../../core/case/default-engine';
import type { Comparison } from '../../core/compare/compare-tests';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { numberIn, ROOT, SCREENSHOTS, startWorkbench, type Workbench } from './harness';

let bench: Workbench;
let page: Page;
let reference: CaseOutcome<Comparison>;

/** Core's own result on the demo pair, computed here without the page. */
function referenceOutcome(): CaseOutcome<Comparison> {
  const day1 = { name: DEMO_PAIR.day1, bytes: new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1))) };
  const day2 = { name: DEMO_PAIR.day2, bytes: new Uint8Array(readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day2))) };
  const caseFile = newCase('2026-01-01T00:00:00Z', day1, day2, DEFAULT_SETTINGS, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  const outcome = recomputeCase(caseFile, { day1: day1.bytes, day2: day2.bytes }, defaultEngine);
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.value;
}

/** Linear interpolation of y at x between the two neighbouring points (x ascending). */
function interpolate(xs: readonly number[], ys: readonly number[], x: number): number {
  for (let i = 1; i < xs.length; i++) {
    if (xs[i] >= x) return ys[i - 1] + ((x - xs[i - 1]) / (xs[i] - xs[i - 1])) * (ys[i] - ys[i - 1]);
  }
  return ys[ys.length - 1];
}

const cell = (row: string, column: number) => page.locator(`${row} > :nth-child(${column})`).textContent();
const shot = (name: string) => page.screenshot({ path: join(SCREENSHOTS, `${name}.png`), fullPage: true });

async function goTo(label: string) {
  await page.locator('nav.screens button', { hasText: label }).click();
}

beforeAll(async () => {
  reference = referenceOutcome();
  bench = await startWorkbench();
  page = await bench.newPage();
  await page.goto(bench.bridge.url);
  await page.fill('input[aria-label="Reviewer name"]', 'R. Okafor');
  await page.fill('input[aria-label="Reviewer role"]', 'exercise physiologist');
});

afterAll(async () => {
  await bench?.close();
});

describe('browser mode, demo pair', () => {
  let overrideTimeS = 0;
  let overrideVo2 = 0;

  it('loads the demo pair and shows the thresholds core computes', async () => {
    await shot('1-intake');
    await page.click('button[data-command="case.demo"]');
    await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 120_000 });
    const day1Vt1 = numberIn(await cell('[data-testid="row-vt1"]', 4));
    // The page's VT1 is core's consensus on the same file, to the mL/min shown.
    expect(day1Vt1).toBe(Math.round(reference.day1.analysis.vt1.at!.vo2MlMin));
    await page.waitForTimeout(500);
    await shot('2-breakpoints-day1');

    await page.locator('.day-tab', { hasText: 'Day 2' }).click();
    const day2Vt1 = numberIn(await cell('[data-testid="row-vt1"]', 4));
    expect(day2Vt1).toBe(Math.round(reference.day2.analysis.vt1.at!.vo2MlMin));
    // The demo scenario is the declining pair: day 2 reaches VT1 at a lower VO2 (sample-tests/scenario).
    expect(day2Vt1).toBeLessThan(day1Vt1);
  });

  it('shows the comparison core computes, then overrides day-2 VT1 with a reason and sees it change', async () => {
    await goTo('Day 2 vs Day 1');
    const row = '[data-testid="metric-table"] tr[data-metric="vt1_vo2"]';
    await page.waitForSelector(row);
    const before = reference.comparison.metrics.find((m) => m.id === 'vt1_vo2')!;
    expect(numberIn(await cell(row, 3))).toBe(Math.round(before.day2!));
    await shot('3-day-over-day-automatic');

    await goTo('Breakpoints');
    await page.locator('.day-tab', { hasText: 'Day 2' }).click();
    const auto = reference.day2.analysis;
    overrideTimeS = Math.round(auto.vt1.at!.timeS) + 40;
    // VO2 at the typed time: straight line between the two averaged points around it.
    overrideVo2 = interpolate(auto.series.timeS, auto.series.vo2MlMin, overrideTimeS);
    await page.fill('[data-testid="override-value"]', String(overrideTimeS));
    // The reason is required: without it the button stays disabled.
    expect(await page.isDisabled('[data-testid="override-apply"]')).toBe(true);
    await page.fill('[data-testid="override-reason"]', 'Excess-CO2 rise is clearer 40 s later; consensus pulled early by the V-slope split.');
    await page.click('[data-testid="override-apply"]');
    await page.waitForSelector('[data-testid="override-vt1"]');
    expect(await cell('[data-testid="row-vt1"]', 2)).toContain('reviewer (entry 1)');
    expect(numberIn((await cell('[data-testid="row-vt1"]', 3))!.split('(')[1])).toBe(overrideTimeS);
    // The time reads m:ss first: e.g. 372 s → "6:12".
    const minutes = Math.floor(overrideTimeS / 60);
    expect((await cell('[data-testid="row-vt1"]', 3))!.startsWith(`${minutes}:${String(overrideTimeS - minutes * 60).padStart(2, '0')}`)).toBe(true);
    // The reviewer's threshold is marked as such beside its name; day-2 VT2 stays unmarked.
    expect(await cell('[data-testid="row-vt1"]', 1)).toContain('reviewer-set (entry 1)');
    expect(await page.locator('[data-testid="row-vt2"] [data-testid="reviewer-mark"]').count()).toBe(0);
    // No developer timings where a person reads them.
    expect(await page.locator('[data-testid="timing"]').isVisible()).toBe(true); // measurable by the timing test …
    const box = await page.locator('[data-testid="timing"]').boundingBox();
    expect(box!.width * box!.height).toBeLessThanOrEqual(1); // … but a 1-px clip, not text on screen
    const hidden = await page.locator('[data-testid="timing"]').innerText();
    expect((await page.locator('body').innerText()).replace(hidden, '')).not.toMatch(/Recomputed in|analysis worker|\bms\b/);
    expect(numberIn(await cell('[data-testid="row-vt1"]', 4))).toBe(Math.round(overrideVo2));
    await page.waitForSelector('[data-testid="charts-ms"]');
    await shot('4-breakpoints-day2-override');

    await goTo('Day 2 vs Day 1');
    await page.waitForSelector(row);
    const day1 = before.day1!;
    expect(numberIn(await cell(row, 2))).toBe(Math.round(day1));
    expect(numberIn(await cell(row, 3))).toBe(Math.round(overrideVo2));
    // Change % = 100 · (day 2 − day 1) / day 1, shown to one decimal.
    expect(numberIn(await cell(row, 5))).toBeCloseTo((100 * (overrideVo2 - day1)) / day1, 1);
    // Day 2's VT1 values are the reviewer's, and say so; day 1's are automatic and carry no mark.
    expect(await cell(row, 3)).toContain('reviewer-set (entry 1)');
    expect(await cell(row, 2)).not.toContain('reviewer-set');
    expect(await cell('[data-testid="metric-table"] tr[data-metric="peak_vo2"]', 3)).not.toContain('reviewer-set');
    // The incremental phase's duration reads m:ss, computed here from core's seconds.
    const duration = reference.comparison.metrics.find((m) => m.id === 'duration')!;
    const whole = Math.round(duration.day1!);
    expect(await cell('[data-testid="metric-table"] tr[data-metric="duration"]', 2)).toBe(`${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`);
    await shot('5-day-over-day-after-override');
  });

  it('records a sign-off: reviewer, role and statement required, one entry in the reviewer log', async () => {
    await goTo('Sign-off');
    expect(await page.locator('[data-testid="signoff-status"]').textContent()).toContain('draft');
    await page.fill('[data-testid="signoff-who"]', 'R. Okafor');
    await page.fill('[data-testid="signoff-role"]', '');
    await page.fill('[data-testid="signoff-statement"]', 'Reviewed both tests; day-2 VT1 moved as logged; values accepted.');
    // Role is required: without it the button stays disabled.
    expect(await page.isDisabled('[data-testid="signoff-record"]')).toBe(true);
    await page.fill('[data-testid="signoff-role"]', 'exercise physiologist');
    await page.click('[data-testid="signoff-record"]');
    await page.waitForFunction(() => document.querySelector('[data-testid="signoff-status"]')?.textContent?.startsWith('Signed off by'));
    expect(await page.locator('[data-testid="signoff-status"]').textContent()).toContain('entry 2');
    // The opening entry (0), the override (1) and the sign-off (2): one new entry, the last.
    expect(await page.locator('[data-testid="review-log"] li').count()).toBe(3);
    expect(await page.locator('[data-testid="review-log"] li').nth(2).textContent()).toContain('Signed off: Reviewed both tests');
  });

  it('exports a signed PDF that twofold verify and pdfsig accept', async () => {
    await goTo('Sign-off');
    await page.click('[data-testid="preview"]');
    await page.waitForSelector('[data-testid="preview-frame"]', { timeout: 120_000 });
    await page.waitForTimeout(1500);
    await shot('6a-sign-off-preview');
    expect(await page.locator('[data-testid="signer"] option:checked').textContent()).toContain('DEMONSTRATION');
    await page.click('[data-testid="export"]');
    await page.waitForSelector('[data-testid="export-path"]', { timeout: 120_000 });
    const path = (await page.locator('[data-testid="export-path"]').textContent())!;
    expect(path.startsWith(join(bench.dataDir, 'cases'))).toBe(true);
    // Exit 0 is required here; execFileSync throws on any other exit code.
    const out = execFileSync('node', [join(ROOT, 'bin', 'twofold.mjs'), 'verify', path, '--trust', join(bench.dataDir, 'certificates', 'demo-certificate.pem')], { encoding: 'utf8', timeout: 120_000 });
    expect(out).toContain('The report is intact, signed by a trusted certificate, and its numbers and pages reproduce.');
    // poppler's own check of the CMS signature over the byte range.
    const sig = execFileSync('pdfsig', [path], { encoding: 'utf8' });
    expect(sig).toContain('Signature Validation: Signature is Valid.');
    // The sign-off recorded on screen is the one the report states (poppler's text extraction).
    const text = execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('Reviewed both tests');
    expect(text).not.toContain('No sign-off statement is recorded');

    await page.click('text=Verify this report');
    await page.waitForSelector('[data-testid="verification"]', { timeout: 120_000 });
    expect(await page.locator('[data-testid="verification"]').textContent()).toContain('Valid');
    await shot('6b-sign-off-verified');

    // A chosen PDF goes through the same checks; one changed byte inside the signed range must fail them.
    const bytes = readFileSync(path);
    const tampered = Buffer.from(bytes);
    const at = tampered.indexOf('Two-day');
    expect(at).toBeGreaterThan(0);
    tampered[at] = 'X'.charCodeAt(0);
    await page.setInputFiles('[data-testid="verify-input"]', { name: 'tampered.pdf', mimeType: 'application/pdf', buffer: tampered });
    await page.waitForFunction(() => document.querySelector('[data-testid="verification"]')?.textContent?.includes('tampered.pdf'), undefined, { timeout: 120_000 });
    expect(await page.locator('[data-testid="verification"]').textContent()).toContain('Not valid');
    await page.setInputFiles('[data-testid="verify-input"]', { name: 'chosen.pdf', mimeType: 'application/pdf', buffer: bytes });
    await page.waitForFunction(() => document.querySelector('[data-testid="verification"]')?.textContent?.includes('chosen.pdf'), undefined, { timeout: 120_000 });
    expect(await page.locator('[data-testid="verification"]').textContent()).toContain('✔ Valid');
  }, 240_000);

  it('after a reload, the reopened case still holds the override and its log entry', async () => {
    await page.reload();
    await page.waitForSelector('.recent li');
    // The intake screen carries the clinical caution too, before any file is chosen.
    expect(await page.locator('.intake [aria-label="Clinical caution"]').textContent()).toContain('does not diagnose');
    await shot('7-intake-recent');
    await page.locator('.recent button').first().click();
    await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 120_000 });
    await page.locator('.day-tab', { hasText: 'Day 2' }).click();
    await page.waitForSelector('[data-testid="override-vt1"]');
    expect(await page.locator('[data-testid="override-vt1"]').textContent()).toContain('Excess-CO2 rise is clearer');
    expect(numberIn(await cell('[data-testid="row-vt1"]', 4))).toBe(Math.round(overrideVo2));
    await goTo('Sign-off');
    // The opening entry (0), the override and the sign-off, all saved.
    expect(await page.locator('[data-testid="review-log"] li').count()).toBe(3);
    expect(await page.locator('[data-testid="signoff-status"]').textContent()).toContain('R. Okafor (exercise physiologist)');
  });

  it('made no request outside 127.0.0.1', () => {
    expect(bench.outside).toEqual([]);
    // The preview did open the browser's own PDF viewer (internal files, no network).
    expect(bench.builtIn.length).toBeGreaterThan(0);
  });
});
