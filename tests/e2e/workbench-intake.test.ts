/**
 * End to end in browser mode: opening files at intake. References outside the page: core
 * run directly in Node on the same .xlsx and CSV (the page must show exactly its VT1), the
 * case folders on disk (a failed try leaves none), and the demo pair's own case (loading it
 * again reopens that case rather than copying the files a second time). Every invented
 * export layout in sample-tests/layouts is opened the same way and must give core's VT1.
 * Impossible data: a file refused by core (exit 2 at the command line) is refused here with
 * its line and leaves no case; a file analysed with its effort left undecided shows that
 * verdict and its reason, and no number on screen is written in exponent form.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { readBreathFile } from '../../core/import/read-table';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { numberIn, ROOT, SCREENSHOTS, startWorkbench, type Workbench } from './harness';

const XLSX = join(ROOT, 'sample-tests', 'layouts', 'workbook', 'qh0417-day1.xlsx');
const DAY2 = join(DEMO_FOLDER, DEMO_PAIR.day2);

let bench: Workbench;
let page: Page;

const caseFolders = () => {
  try {
    return readdirSync(join(bench.dataDir, 'cases')).filter((n) => n.startsWith('case-'));
  } catch {
    return [];
  }
};

/** Chooses a file for a day through the page's file chooser (a click on the drop area). */
async function choose(day: 1 | 2, file: string | { name: string; mimeType: string; buffer: Buffer }) {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.locator(`.drop.day${day}`).click()]);
  await chooser.setFiles(file);
  await page.waitForFunction((d) => !document.querySelector(`.drop.day${d} .drop-name`)?.textContent?.startsWith('Drop a file'), day);
}

beforeAll(async () => {
  bench = await startWorkbench();
  page = await bench.newPage();
  await page.goto(bench.bridge.url);
});

afterAll(async () => {
  await bench?.close();
});

/** Chooses day 1 (and the CSV day 2), names the case and starts it, accepting the column mapping when asked; no error notice. */
async function startCase(day1: string, title: string): Promise<void> {
  await choose(1, day1);
  await choose(2, DAY2);
  await page.fill('.intake input[placeholder^="e.g. subject"]', title);
  await page.click('text=Start case');
  await page.waitForSelector('[data-testid="thresholds-day1"], [data-testid="mapping-step"], .error-notice', { timeout: 120_000 });
  if (await page.locator('[data-testid="mapping-step"]').count()) {
    await page.click('text=Use these columns and remember them for this layout');
    await page.waitForSelector('[data-testid="thresholds-day1"], .error-notice', { timeout: 120_000 });
  }
  expect(await page.locator('.error-notice').count()).toBe(0);
}

describe('browser mode, intake', () => {
  it('a file that cannot be read names the real cause and leaves no case behind', async () => {
    await choose(1, { name: 'broken.xlsx', mimeType: 'application/octet-stream', buffer: Buffer.from('PK\u0003\u0004 this is not a workbook') });
    await choose(2, DAY2);
    await page.click('text=Start case');
    await page.waitForSelector('.error-notice', { timeout: 120_000 });
    const message = (await page.locator('.error-notice').textContent())!;
    expect(message).toContain('broken.xlsx');
    expect(message).toContain('cannot be opened');
    // The browser build reads workbooks itself: no Node-only API shows through.
    expect(message).not.toContain('Buffer');
    expect(caseFolders()).toEqual([]);
    await page.reload();
    expect(await page.locator('.recent li').count()).toBe(0);
  });

  it('opens an .xlsx chosen through the file chooser, with the VT1 core finds in Node', async () => {
    // As `twofold analyze` reads it: the one importer (async for a workbook), then the analysis.
    const imported = await readBreathFile(new Uint8Array(readFileSync(XLSX)), { sourceName: 'qh0417-day1.xlsx', settings: DEFAULT_SETTINGS });
    if (!imported.ok) throw new Error(imported.error.message);
    const reference = analyzeTest(imported.value.table, DEFAULT_SETTINGS, noClinicalInputs());

    await startCase(XLSX, 'Workbook day 1, CSV day 2');
    expect(await page.locator('.day-tab').first().textContent()).toContain('qh0417-day1.xlsx');
    const vt1 = numberIn(await page.locator('[data-testid="row-vt1"] > :nth-child(4)').textContent());
    expect(vt1).toBe(Math.round(reference.vt1.at!.vo2MlMin));
    expect(caseFolders().length).toBe(1);
  });

  it('loading the demo pair twice reopens its case instead of adding another', async () => {
    await page.click('button[data-command="case.demo"]');
    await page.waitForFunction(() => document.querySelector('[data-testid="case-title"]')?.textContent?.startsWith('Demo pair'), undefined, { timeout: 120_000 });
    await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 120_000 });
    expect(caseFolders().length).toBe(2);
    // The reopen keeps the same title and the same panels, so wait for its analysis to reach the
    // screen (the title's open count): opening a case moves to Breakpoints when it is done, and a
    // click on Intake before that would be undone by it.
    const openedBefore = Number(await page.getAttribute('[data-testid="case-title"]', 'data-opened'));
    await page.click('button[data-command="case.demo"]');
    await page.waitForFunction((n) => Number(document.querySelector('[data-testid="case-title"]')?.getAttribute('data-opened')) > n, openedBefore, { timeout: 120_000 });
    await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 120_000 });
    expect(caseFolders().length).toBe(2);
    await page.locator('nav.screens button', { hasText: 'Intake' }).click();
    await page.waitForSelector('.recent li', { timeout: 120_000 });
    expect(await page.locator('.recent li').count()).toBe(2);
    await page.screenshot({ path: join(SCREENSHOTS, '7b-intake-after-xlsx-and-demo.png'), fullPage: true });
  });

  for (const [layout, file] of [
    ['semicolon, decimal comma, narrative preamble', 'narrative-semicolon/qh0417-day1.txt'],
    ['quoted UTF-16 with a label/value block', 'quoted-utf16/qh0417-day1.csv'],
    ['tab-separated, units row, clock times', 'tabbed-units-clock/qh0417-day1.tsv'],
  ] as const) {
    it(`opens the ${layout} layout through the file chooser with the VT1 core finds`, async () => {
      const path = join(ROOT, 'sample-tests', 'layouts', file);
      const imported = await readBreathFile(new Uint8Array(readFileSync(path)), { sourceName: basename(path), settings: DEFAULT_SETTINGS });
      if (!imported.ok) throw new Error(imported.error.message);
      const reference = analyzeTest(imported.value.table, DEFAULT_SETTINGS, noClinicalInputs());
      await page.locator('nav.screens button', { hasText: 'Intake' }).click();
      await startCase(path, `Layout: ${layout}`);
      await page.waitForFunction((name) => document.querySelector('.day-tab')?.textContent?.includes(name), basename(path));
      expect(numberIn(await page.locator('[data-testid="row-vt1"] > :nth-child(4)').textContent())).toBe(Math.round(reference.vt1.at!.vo2MlMin));
    });
  }

  it('impossible data: a refused file names its line and leaves no case; one with 10 % impossible breaths shows an undecided effort and why', async () => {
    const text = readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day1), 'utf8').split('\n');
    const header = text.findIndex((l) => l.startsWith('time_s'));
    const edit = (f: (cells: string[], i: number) => string[]) => Buffer.from(text.map((l, i) => (i > header && l.trim() !== '' ? f(l.split(','), i - header - 1).join(',') : l)).join('\n'));
    const before = caseFolders().length;
    await page.locator('nav.screens button', { hasText: 'Intake' }).click();
    // Every VE cell 1e300: refused at its first cell (line of the first data row, column 4).
    await choose(1, { name: 've-huge.csv', mimeType: 'text/csv', buffer: edit((c) => c.map((v, k) => (k === 3 ? '1e300' : v))) });
    await choose(2, DAY2);
    await page.click('text=Start case');
    await page.waitForSelector('.error-notice', { timeout: 120_000 });
    const refused = (await page.locator('.error-notice').textContent())!;
    expect(refused).toContain(`line ${header + 2}, column 4`);
    expect(refused).toContain('more than 20 %');
    expect(refused).not.toMatch(/\d(?:\.\d+)?e[+-]\d/);
    // The refusal is on screen as soon as the analysis fails; the new case folder is removed
    // by the next call to the host (App.tsx startCase), a few ms later.
    await expect.poll(() => caseFolders().length, { timeout: 10_000 }).toBe(before);

    // VO2 1e300 on one breath in ten (43 of 430): analysed without them, effort indeterminate with the reason.
    await page.reload();
    await choose(1, { name: 'vo2-tenth-huge.csv', mimeType: 'text/csv', buffer: edit((c, i) => (i % 10 === 5 ? c.map((v, k) => (k === 1 ? '1e300' : v)) : c)) });
    await choose(2, DAY2);
    await page.click('text=Start case');
    await page.waitForSelector('[data-testid="thresholds-day1"], .error-notice', { timeout: 120_000 });
    expect(await page.locator('.error-notice').count()).toBe(0);
    expect(await page.locator('[data-testid="effort-day1"]').textContent()).toBe('indeterminate');
    expect(await page.locator('.reasons li').first().textContent()).toContain('Effort not judged: 43 of 430 breaths (10 %, more than 5 %) have values outside physiology');
    expect(await page.locator('body').innerText()).not.toMatch(/\d(?:\.\d+)?e[+-]\d|Infinity|NaN/);
    await page.locator('nav.screens button', { hasText: 'Day 2 vs Day 1' }).click();
    await page.waitForSelector('[data-testid="metric-table"]');
    expect(await page.locator('body').innerText()).not.toMatch(/\d(?:\.\d+)?e[+-]\d|Infinity|NaN/);
  });

  it('made no request outside 127.0.0.1', () => {
    expect(bench.outside).toEqual([]);
  });
});
