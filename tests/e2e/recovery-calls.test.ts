/**
 * End to end in browser mode: a follow-up is entered on the Recovery calls screen with the
 * keyboard only (Ctrl+5 to open it, Tab between fields, Enter to record), is shown with the
 * time to reported recovery core derives, is corrected with a reason, and appears in the
 * signed PDF the workbench exports (read back with poppler's pdftotext, an independent
 * reader); `twofold verify` accepts the PDF (exit 0). Expected values are the keys typed.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ROOT, SCREENSHOTS, startWorkbench, type Workbench } from './harness';

let bench: Workbench;
let page: Page;

beforeAll(async () => {
  bench = await startWorkbench();
  page = await bench.newPage();
  await page.goto(bench.bridge.url);
  await page.fill('input[aria-label="Reviewer name"]', 'K. Lindqvist');
  await page.fill('input[aria-label="Reviewer role"]', 'lab coordinator');
  await page.click('button[data-command="case.demo"]');
  await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 120_000 });
});

afterAll(async () => {
  await bench?.close();
});

/** Types into the focused field (replacing what it holds) and moves on with Tab. */
async function field(text: string | null): Promise<void> {
  if (text !== null) {
    await page.keyboard.press('Control+A');
    await page.keyboard.type(text);
  }
  await page.keyboard.press('Tab');
}

/** Waits (up to 10 s, for a loaded machine) until the focused element is the form field `name`: focus moves in an effect after the render. */
async function focusOn(name: string): Promise<void> {
  await page.waitForFunction((n) => (document.activeElement as HTMLElement | null)?.dataset.field === n, name, { timeout: 10_000 });
  expect(await page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.field)).toBe(name);
}

describe('Recovery calls, keyboard only', () => {
  it('records a follow-up typed with the keyboard and shows the recovery core derives', async () => {
    await page.keyboard.press('Control+5');
    await page.waitForSelector('[data-testid="follow-up-form"]');
    const started = Date.now();
    // The Test box has the focus when the screen opens.
    await field('2'); // test
    await field('20'); // hours after
    await field(null); // reported by: "the person" kept
    await field('p'); // how: phone
    await field('n'); // back to usual: no
    for (const score of ['8', '6', '5', '7', '4', '']) await field(score); // the six default domains; the last not asked
    await field(null); // other domain
    await field(null); // its rating
    await field('Stayed in bed; quillfeather tea helped'); // note
    await page.keyboard.type('Scheduled call');
    const typedMs = Date.now() - started;
    const enter = Date.now();
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-testid="follow-up-1"]', { timeout: 30_000 });
    const recordMs = Date.now() - enter;
    const row = await page.locator('[data-testid="follow-up-1"]').textContent();
    expect(row).toContain('day 2');
    expect(row).toContain('20 h');
    expect(row).toContain('the person, phone');
    expect(row).toContain('not back');
    expect(row).toContain('fatigue 8, thinking and memory 6, pain 5, sleep 7, light-headedness on standing 4');
    expect(row).not.toContain('flu-like');
    expect(row).toContain('quillfeather tea');
    expect(await page.locator('[data-testid="recovery-day2"]').textContent()).toContain('not recovered by the last follow-up at 0.8 days (20 h)');
    // The software's share of "under a minute per entry": automated typing plus recording. The
    // person's typing speed is not measured here (docs/workbench.md gives the keystroke count).
    console.log(`follow-up entry: typed in ${typedMs} ms, recorded and shown ${recordMs} ms after Enter (shared machine, under load)`);
    expect(recordMs).toBeLessThan(15_000);

    // The form keeps test, reporter and channel for the next call, and the focus is on the hours.
    expect(await page.locator('[data-field="test"]').inputValue()).toBe('2');
    await focusOn('hours');
    await field('3d');
    await field(null);
    await field(null);
    await field('y');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-testid="follow-up-2"]', { timeout: 30_000 });
    expect(await page.locator('[data-testid="recovery-day2"]').textContent()).toContain('reported back to usual state by 72 h (3 days), not yet at 20 h');
    await page.waitForTimeout(500);
    await page.screenshot({ path: join(SCREENSHOTS, '10-recovery-calls.png'), fullPage: true });
  });

  it('refuses a bad field without losing what was typed', async () => {
    await page.locator('[data-field="hours"]').focus();
    await field('soon');
    await page.keyboard.press('Enter');
    expect(await page.locator('[data-testid="follow-up-problem"]').textContent()).toContain('Hours after the test: expected hours after the end of the test');
    await focusOn('hours');
    expect(await page.locator('[data-field="hours"]').inputValue()).toBe('soon');
    expect(await page.locator('[data-testid="follow-up-3"]').count()).toBe(0);
    await page.keyboard.press('Control+A');
    await page.keyboard.press('Backspace');
  });

  it('corrects an entry with a reason; the correction is a new log entry', async () => {
    await page.locator('[data-testid="follow-up-2"] button', { hasText: 'Correct' }).click();
    await focusOn('hours');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('96');
    await page.keyboard.press('Enter');
    // No reason yet: refused, and the focus goes to the reason box.
    expect(await page.locator('[data-testid="follow-up-problem"]').textContent()).toContain('a correction needs a reason');
    await page.keyboard.type('The call was on the fourth day');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => document.querySelector('[data-testid="follow-up-2"]')?.textContent?.includes('corrected in entry 3'), undefined, { timeout: 30_000 });
    expect(await page.locator('[data-testid="follow-up-2"]').textContent()).toContain('96 h (4 days)');
    expect(await page.locator('[data-testid="recovery-day2"]').textContent()).toContain('reported back to usual state by 96 h (4 days), not yet at 20 h');
  });

  it('exports a signed PDF whose follow-up page shows the entry; twofold verify accepts it', async () => {
    await page.keyboard.press('Control+e');
    await page.waitForSelector('[data-testid="export-path"]', { timeout: 120_000 });
    const path = (await page.locator('[data-testid="export-path"]').textContent())!;
    // Lines joined: the summary wraps at the page width.
    const text = execFileSync('pdftotext', [path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('Recovery after each test, as reported');
    expect(text).toContain('quillfeather tea');
    expect(text).toMatch(/after the day 2 test, reported back to usual state by 96 h \(4 days\), not yet at 20 h/);
    expect(text).toContain('corrected in entry 3 by K. Lindqvist');
    // Signed with this session's demonstration certificate, which the workbench writes to
    // <dataDir>/certificates/demo-certificate.pem (host/workbench/wiring.ts): the trust list.
    const trust = join(bench.dataDir, 'certificates', 'demo-certificate.pem');
    const out = execFileSync('node', [join(ROOT, 'bin', 'twofold.mjs'), 'verify', path, '--trust', trust], { encoding: 'utf8', timeout: 120_000 });
    expect(out).toContain('The report is intact, signed by a trusted certificate, and its numbers and pages reproduce.');
  }, 240_000);
});
