/**
 * End to end in browser mode: Debian's Chromium drives the real page against the real host
 * on 127.0.0.1. References outside the page: core run directly in Node on the same files
 * (the page must show exactly those numbers, so it holds no analysis of its own), linear
 * interpolation worked by hand, the demo scenario's stated outcome (day 2 reaches VT1 at a
 * lower VO2), `twofold verify` (exit 0) and poppler's `pdfsig` as independent verdicts on the
 * signed PDF, poppler's `pdftotext` reading the report's pages back, m:ss worked by hand
 * (floor(s / 60), then the seconds padded), and the palette's stated colour for each verdict.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
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
import { vslopeView } from '../../core/report/vslope-view';
import { verdictStyle } from '../../core/palette';
import { numberIn, ROOT, SCREENSHOTS, SCREENSHOTS_ENV, startWorkbench, type Workbench } from './harness';

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

/** m:ss worked by hand: 814 s → '13:34'. */
const byHand = (s: number) => {
  const whole = Math.round(s);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
};

/** The tracked screenshots and their SHA-256, to show an ordinary run leaves them untouched. */
const TRACKED = join(ROOT, 'docs', 'screenshots');
const refreshing = process.env[SCREENSHOTS_ENV] === 'docs';
const trackedHashes = () => Object.fromEntries(readdirSync(TRACKED).filter((n) => n.endsWith('.png')).map((n) => [n, createHash('sha256').update(readFileSync(join(TRACKED, n))).digest('hex')]));
let trackedBefore: Record<string, string> = {};
let draftPath = '';
const startedMs = Date.now();

/**
 * Moves the mouse onto point `k` of trace `traceName` of a plotly chart and returns the hover
 * label's text and the point's x (plotly's own axis mapping gives the pixel).
 */
async function hoverPoint(testId: string, traceName: string, k: number): Promise<{ text: string; x: number }> {
  const chart = page.locator(`[data-testid="${testId}"]`);
  await chart.scrollIntoViewIfNeeded();
  const at = await chart.evaluate(
    (el, [name, index]) => {
      const gd = el as unknown as { _fullLayout: Record<string, { _offset: number; l2p: (v: number) => number }>; _fullData: { name: string; x: number[]; y: (number | null)[]; yaxis?: string }[] };
      const trace = gd._fullData.find((t) => t.name === name)!;
      let i = index as number;
      while (trace.y[i] === null || !Number.isFinite(trace.y[i] as number)) i++;
      const xa = gd._fullLayout.xaxis;
      const ya = gd._fullLayout[trace.yaxis === 'y2' ? 'yaxis2' : 'yaxis'];
      return { px: xa._offset + xa.l2p(trace.x[i]), py: ya._offset + ya.l2p(trace.y[i] as number), x: trace.x[i] };
    },
    [traceName, k] as const,
  );
  const box = (await chart.boundingBox())!;
  await page.mouse.move(box.x + at.px, box.y + at.py);
  await page.waitForFunction((id) => (document.querySelector(`[data-testid="${id}"] .hoverlayer`)?.textContent ?? '') !== '', testId, { timeout: 5000 });
  const text = (await chart.locator('.hoverlayer').textContent())!;
  // The point plotly chose (the nearest to the pointer, which may be a neighbour of point k).
  const hovered = await chart.evaluate((el) => (el as unknown as { _hoverdata: { x: number }[] })._hoverdata[0].x);
  await page.mouse.move(0, 0);
  expect(Math.abs(hovered - at.x)).toBeLessThan(60);
  return { text, x: hovered };
}

type Box = { x: number; y: number; width: number; height: number };
/** The distance between two boxes (0 when they touch or overlap). */
function gap(a: Box, b: Box): number {
  const dx = Math.max(0, b.x - (a.x + a.width), a.x - (b.x + b.width));
  const dy = Math.max(0, b.y - (a.y + a.height), a.y - (b.y + b.height));
  return Math.hypot(dx, dy);
}
const shot = (name: string) => page.screenshot({ path: join(SCREENSHOTS, `${name}.png`), fullPage: true });

async function goTo(label: string) {
  await page.locator('nav.screens button', { hasText: label }).click();
}

beforeAll(async () => {
  trackedBefore = trackedHashes();
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

  it('charts: hover labels read m:ss; the V-slope at 1440×900 is square with its identity line, both slopes, and its legend clear of the axis titles', async () => {
    await page.setViewportSize({ width: 1440, height: 900 });
    await goTo('Breakpoints');
    await page.locator('.day-tab', { hasText: 'Day 1' }).click();
    await page.waitForSelector('[data-testid="chart-vslope"] .legend');
    // Ventilatory equivalents and end-tidal pressures: the hovered time is the point's m:ss, never its seconds.
    for (const [id, trace] of [['chart-equivalents', 'VE/VO₂'], ['chart-endtidal', 'PetCO₂']] as const) {
      const h = await hoverPoint(id, trace, 200);
      expect(h.text).toContain(byHand(h.x));
      expect(h.text).not.toContain(String(Math.round(h.x)));
    }
    // V-slope: a point names its time of the recording in m:ss.
    const v = await hoverPoint('chart-vslope', 'VCO₂ against VO₂ (analysed window)', 40);
    expect(v.text).toMatch(/\d+:\d\d, VO₂ \d/);

    const chart = page.locator('[data-testid="chart-vslope"]');
    const geometry = await chart.evaluate((el) => {
      const gd = el as unknown as { _fullLayout: Record<string, { _length: number; range: number[] }>; _fullData: { name: string; x: number[] }[] };
      const per = (a: { _length: number; range: number[] }) => a._length / (a.range[1] - a.range[0]);
      return { xPx: per(gd._fullLayout.xaxis), yPx: per(gd._fullLayout.yaxis), names: gd._fullData.map((t) => t.name), analysed: gd._fullData.find((t) => t.name.startsWith('VCO₂ against VO₂'))!.x.length };
    });
    // Equal scales: one mL/min is as many pixels on VO₂ as on VCO₂.
    expect(Math.abs(geometry.xPx / geometry.yPx - 1)).toBeLessThan(0.01);
    const view = vslopeView(reference.day1.analysis, { vt1: reference.day1.vt1.effective, vt2: reference.day1.vt2.effective });
    expect(geometry.names).toContain('line of identity (slope 1)');
    expect(geometry.names).toContain(`below VT1: slope ${view.lines[0].slope.toFixed(2)}`);
    expect(geometry.names).toContain(`above VT1: slope ${view.lines[1].slope.toFixed(2)}`);
    // Only the analysed window (incremental phase up to VT2) is drawn as the fitted cloud.
    const a = reference.day1.analysis;
    expect(geometry.analysed).toBe(a.series.timeS.filter((t) => t >= a.phases.incrementalStartS && t <= reference.day1.vt2.effective!.timeS).length);
    // The legend keeps at least 8 px from both axis titles and stays inside the chart's box.
    const legend = (await chart.locator('.legend').boundingBox())!;
    const outer = (await chart.boundingBox())!;
    for (const title of ['.xtitle', '.ytitle']) expect(gap(legend, (await chart.locator(title).boundingBox())!)).toBeGreaterThanOrEqual(8);
    expect(legend.x + legend.width).toBeLessThanOrEqual(outer.x + outer.width);
    expect(legend.y + legend.height).toBeLessThanOrEqual(outer.y + outer.height);
    await chart.screenshot({ path: join(SCREENSHOTS, '2b-vslope-1440x900.png') });
    // The effort table prints each rule as applied and the combination with its standing (settings defaults).
    const rerRow = page.locator('.breakpoints table.values tr', { hasText: 'Peak RER' }).last();
    expect(await rerRow.textContent()).toContain('rule: peak RER ≥ 1.10');
    expect(await page.locator('.reasons li').first().textContent()).toBe(reference.day1.analysis.effort.reasons[0]);
    await page.setViewportSize({ width: 1440, height: 1000 });
  });

  it('Day 2 vs Day 1: verdicts coloured by harm with words, matched workloads say how they were read, overlays hover in m:ss', async () => {
    await goTo('Day 2 vs Day 1');
    await page.waitForSelector('[data-testid="metric-table"]');
    // Compared against the automatic comparison on rows the override does not touch.
    for (const id of ['peak_vo2', 've_vco2_slope', 'peak_rer']) {
      const m = reference.comparison.metrics.find((x) => x.id === id)!;
      expect(m, id).toBeDefined();
      const style = verdictStyle(m.verdict, m.adverseBeyondBand);
      const verdictCell = page.locator(`[data-testid="metric-table"] tr[data-metric="${id}"] td.verdict`);
      expect(await verdictCell.textContent()).toContain(style.words);
      const colour = await verdictCell.locator('.chip').evaluate((el) => getComputedStyle(el).backgroundColor);
      const hex = style.colour.replace('#', '');
      expect(colour).toBe(`rgb(${parseInt(hex.slice(0, 2), 16)}, ${parseInt(hex.slice(2, 4), 16)}, ${parseInt(hex.slice(4, 6), 16)})`);
    }
    expect(await page.locator('[data-testid="matched-reading"]').textContent()).toMatch(/local fit/);
    const overlay = page.locator('[aria-label="VO₂ against time, both days"]');
    await overlay.evaluate((el) => el.setAttribute('data-testid', 'overlay-vo2-time'));
    const h = await hoverPoint('overlay-vo2-time', 'Day 1', 150);
    expect(h.text).toContain(byHand(h.x));
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
    expect(Number(await page.locator('[data-testid="row-vt1"] > :nth-child(3)').getAttribute('data-time-s'))).toBe(overrideTimeS);
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

  it('a report exported before any sign-off is marked as a draft on every page', async () => {
    await goTo('Sign-off');
    await page.click('[data-testid="export"]');
    await page.waitForSelector('[data-testid="export-path"]', { timeout: 120_000 });
    const path = (await page.locator('[data-testid="export-path"]').textContent())!;
    draftPath = path;
    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [path], { encoding: 'utf8' }))![1]);
    expect(pages).toBeGreaterThan(3);
    for (let p = 1; p <= pages; p++) expect(execFileSync('pdftotext', ['-f', String(p), '-l', String(p), path, '-'], { encoding: 'utf8' }), `page ${p}`).toContain('DRAFT');
  }, 180_000);

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
    // A new file, not the draft exported before the sign-off.
    await page.waitForFunction((before) => {
      const now = document.querySelector('[data-testid="export-path"]')?.textContent;
      return now && now !== before;
    }, draftPath, { timeout: 120_000 });
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
    // Signed off: no page says draft any more.
    expect(text).not.toContain('DRAFT');
    // Page 1 leads with the finding, then the primary table; the cautions keep their own box.
    const page1 = execFileSync('pdftotext', ['-f', '1', '-l', '1', path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(page1.indexOf('Finding')).toBeGreaterThan(0);
    expect(page1.indexOf('Finding')).toBeLessThan(page1.indexOf('Primary outcome'));
    // Per-day pages: % predicted, METs, Weber class, ΔVO2/ΔWR, HR at VT1 with its labelled rules of thumb.
    for (const words of ['% predicted (FRIEND)', 'METs at peak', 'Weber class', 'ΔVO₂/ΔWR', 'Rule of thumb: 55–60 % of age']) expect(text).toContain(words);
    // Settings in words and units; no raw setting key on any page.
    expect(text).toContain('VO₂ above 8,000 mL/min is treated as implausible.');
    expect(text).not.toMatch(/\b(import|clean|thresholds|effort|bootstrap|peaks|compare)\.[a-z]+[A-Z.][A-Za-z.]*/);

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

  it(`leaves docs/screenshots as it was unless ${SCREENSHOTS_ENV}=docs asks to refresh it`, () => {
    if (refreshing) {
      // Asked to refresh: this file's screenshots were written during this run.
      for (const name of ['1-intake.png', '2-breakpoints-day1.png', '2b-vslope-1440x900.png', '6a-sign-off-preview.png']) expect(statSync(join(TRACKED, name)).mtimeMs).toBeGreaterThanOrEqual(startedMs - 1000);
    } else {
      expect(SCREENSHOTS).not.toBe(TRACKED);
      expect(trackedHashes()).toEqual(trackedBefore);
    }
  });
});
