/**
 * Reviewing a long test through the page: files chosen through the file inputs, the time
 * from an override to the updated values painted (target: 95th percentile at most 50 ms over
 * 30 overrides of a 1,500-breath test, asserted when other work leaves the machine idle),
 * undo, redo and withdrawal, autosave after every change (also two changes in quick
 * succession), and the mapping step for an export whose units the importer had to infer.
 * References: data generated from the project's stated physiological model with known
 * thresholds (sample-tests/generator), linear interpolation worked by hand, core's own
 * recomputeCase on the saved case file and raw copies for the saved record, and the
 * importer's own reading of the layout sample (core/import) for the mapping question.
 * The browser starts with the setting of Twofold's own windows (host/workbench/response-flags.ts:
 * the worker's answer to a click is not held back until the next frame).
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { defaultCycleParams, generateTest } from '../../sample-tests/generator';
import { writeBreathCsv } from '../../core/export/breath-csv';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { loadCase, type LoadedCase } from '../../host/case-folder';
import { defaultEngine } from '../../core/case/default-engine';
import { recomputeCase } from '../../core/case/recompute';
import { numberIn, ROOT, SCREENSHOTS, startWorkbench, type Workbench } from './harness';

let bench: Workbench;
let page: Page;

/** A slow ramp (4 W/min) with small breaths: about 1,500 breaths per test. VT1 1,100 → 850 mL/min on day 2. */
function longPair() {
  const p = defaultCycleParams();
  const base = { ...p, vtMaxL: 1.2, protocol: { ...p.protocol, rampWPerMin: 4 } } as typeof p;
  const day1 = generateTest({ ...base, name: 'long-day1', testStart: '2026-05-04T09:00:00Z' }, 1501);
  const day2 = generateTest({ ...base, name: 'long-day2', testStart: '2026-05-05T09:10:00Z', vt1Vo2MlMin: 850 }, 1502);
  return { day1, day2 };
}

const pair = longPair();
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
/** The 95th percentile, nearest rank: the smallest value with at least 95 % of the values at or below it. */
const p95 = (values: number[]) => [...values].sort((a, b) => a - b)[Math.ceil(0.95 * values.length) - 1];
/** Overrides timed (issue 14: the 95th percentile over at least 30). */
const N = 30;

/**
 * CPU time used so far by the whole machine and by this test process with its descendants
 * (the browser-mode host runs in this process; Chromium and its renderer are its children),
 * in clock ticks of Linux's /proc (proc(5): /proc/stat, /proc/[pid]/stat fields utime, stime,
 * cutime, cstime); null where /proc cannot be read.
 */
function cpuTicks(): { machineBusy: number; ours: number } | null {
  try {
    // user nice system idle iowait irq softirq steal: everything but idle and iowait is busy.
    const [user, nice, system, , , irq, softirq, steal = 0] = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
    const children = new Map<number, number[]>();
    const own = new Map<number, number>();
    for (const entry of readdirSync('/proc')) {
      if (!/^\d+$/.test(entry)) continue;
      let text: string;
      try {
        text = readFileSync(`/proc/${entry}/stat`, 'utf8');
      } catch {
        continue; // exited meanwhile
      }
      // Fields after the command name (which may hold spaces, inside parentheses): state, ppid, …
      const f = text.slice(text.lastIndexOf(')') + 2).split(' ');
      const pid = Number(entry);
      const ppid = Number(f[1]);
      children.set(ppid, [...(children.get(ppid) ?? []), pid]);
      // utime, stime, cutime, cstime: fields 14–17 of the line, 12–15 after the name.
      own.set(pid, Number(f[11]) + Number(f[12]) + Number(f[13]) + Number(f[14]));
    }
    let ours = 0;
    for (const queue = [process.pid]; queue.length; ) {
      const pid = queue.pop()!;
      ours += own.get(pid) ?? 0;
      queue.push(...(children.get(pid) ?? []));
    }
    return { machineBusy: user + nice + system + irq + softirq + steal, ours };
  } catch {
    return null;
  }
}

/** Linux's clock ticks per second for /proc times (USER_HZ, 100 on every mainstream build; getconf CLK_TCK). */
const TICKS_PER_S = 100;
/**
 * Other work (everything outside this test's processes) using less than this many cores on
 * average during the timed overrides counts as an idle machine, where the timing requirement
 * is asserted (our choice: a quarter of this 2-core machine). Above it the machine is shared,
 * the figure is still printed, and only a regression guard is asserted.
 */
const IDLE_OTHER_CORES = 0.5;

/** The one case in the data folder as saved on disk, once its log has `entries` reviewer entries after its opening entry 0 (autosave follows the values). */
async function savedCase(entries: number): Promise<LoadedCase> {
  const casesDir = join(bench.dataDir, 'cases');
  let seen = -1;
  for (const deadline = Date.now() + 15_000; Date.now() < deadline; await new Promise((resolve) => setTimeout(resolve, 50))) {
    const [caseId] = readdirSync(casesDir);
    const loaded = loadCase(join(casesDir, caseId));
    if (loaded.ok) seen = loaded.value.caseFile.log.length - 1;
    if (loaded.ok && seen === entries) return loaded.value;
  }
  throw new Error(`The saved case has ${seen} log entries, expected ${entries}.`);
}

/** Core's own recompute of a saved case gives the record saved with it (what verify checks). */
function expectRecordReproduced(saved: LoadedCase): void {
  const recomputed = recomputeCase(saved.caseFile, saved.raw, defaultEngine);
  expect(recomputed.ok && recomputed.value.recorded).toEqual(saved.caseFile.recorded);
}

const savedNote = () => page.waitForFunction(() => document.querySelector('[data-testid="save-note"]')?.textContent?.startsWith('Saved'));

beforeAll(async () => {
  bench = await startWorkbench();
  page = await bench.newPage();
  await page.goto(bench.bridge.url);
  await page.fill('input[aria-label="Reviewer name"]', 'T. Lindqvist');
  await page.fill('input[aria-label="Reviewer role"]', 'clinical physiologist');
});

afterAll(async () => {
  await bench?.close();
});

describe('the page under test', () => {
  it("is React's production build, as `npm start` serves it (vitest's NODE_ENV=test must not leak into the build)", () => {
    const assets = join(ROOT, 'renderer', 'dist', 'assets');
    const page = readdirSync(assets).filter((f) => /^index-.*\.js$/.test(f));
    expect(page.length).toBe(1);
    // A warning text that only React's development build carries.
    expect(readFileSync(join(assets, page[0]), 'utf8')).not.toContain('Each child in a list should have a unique');
  });
});

describe('a 1,500-breath pair', () => {
  const timings: { worker: number; reply: number; values: number; charts: number; record: number }[] = [];

  it('opens from chosen files and updates every value quickly after each override', async () => {
    const { day1, day2 } = pair;
    expect(day1.table.breaths.length).toBeGreaterThanOrEqual(1500);
    await page.setInputFiles('[data-testid="day1-file"]', { name: 'long-day1.csv', mimeType: 'text/csv', buffer: Buffer.from(writeBreathCsv(day1.table)) });
    await page.setInputFiles('[data-testid="day2-file"]', { name: 'long-day2.csv', mimeType: 'text/csv', buffer: Buffer.from(writeBreathCsv(day2.table)) });
    await page.fill('input[aria-label="Peak RPE day 1"]', '19');
    await page.fill('input[aria-label="Peak RPE day 2"]', '19');
    await page.click('text=Start case');
    await page.waitForSelector('[data-testid="thresholds-day1"]', { timeout: 180_000 });
    await page.locator('.day-tab', { hasText: 'Day 2' }).click();

    const ramp = day2.truth.phases;
    const cpuBefore = cpuTicks();
    const wallBefore = performance.now();
    for (let k = 0; k < N; k++) {
      const t = Math.round(ramp.incrementalStartS + 300 + 10 * k);
      await page.fill('[data-testid="override-value"]', String(t));
      await page.fill('[data-testid="override-reason"]', `timing run ${k + 1}`);
      await page.click('[data-testid="override-apply"]');
      await page.waitForFunction((seq) => document.querySelector('[data-testid="row-vt1"]')?.textContent?.includes(`reviewer (entry ${seq})`), k + 1);
      expect(Number(await page.locator('[data-testid="row-vt1"] > :nth-child(3)').getAttribute('data-time-s'))).toBe(t);
      // The change's own timing (data-revision: its case state), once its charts are drawn too.
      await page.waitForFunction((seq) => {
        const timing = document.querySelector('[data-testid="timing"]');
        return timing?.getAttribute('data-revision') === String(seq + 1) && timing.querySelector('[data-testid="charts-ms"]') !== null;
      }, k + 1);
      // The record (digest and case text) follows the values; its time is on the save note.
      await page.waitForFunction((seq) => document.querySelector('[data-testid="save-note"]')?.getAttribute('data-revision') === String(seq + 1), k + 1);
      timings.push({
        record: numberIn(await page.locator('[data-testid="save-note"]').getAttribute('title')),
        worker: numberIn(await page.locator('[data-testid="worker-ms"]').textContent()),
        reply: numberIn(await page.locator('[data-testid="reply-ms"]').textContent()),
        values: numberIn(await page.locator('[data-testid="values-ms"]').textContent()),
        charts: numberIn(await page.locator('[data-testid="charts-ms"]').textContent()),
      });
    }
    const cpuAfter = cpuTicks();
    const wallS = (performance.now() - wallBefore) / 1000;
    // Cores used on average by work outside this test while the overrides were timed.
    const otherCores = cpuBefore && cpuAfter ? (cpuAfter.machineBusy - cpuBefore.machineBusy - (cpuAfter.ours - cpuBefore.ours)) / TICKS_PER_S / wallS : null;
    const figures = {
      otherCores,
      breaths: day2.table.breaths.length,
      overrides: timings.length,
      workerMs: median(timings.map((x) => x.worker)),
      replyMs: median(timings.map((x) => x.reply)),
      valuesMs: median(timings.map((x) => x.values)),
      valuesP95Ms: p95(timings.map((x) => x.values)),
      valuesMaxMs: Math.max(...timings.map((x) => x.values)),
      chartsMs: median(timings.map((x) => x.charts)),
      recordMs: median(timings.map((x) => x.record)),
    };
    mkdirSync(join(ROOT, '.test-results'), { recursive: true });
    writeFileSync(join(ROOT, '.test-results', 'workbench-timing.json'), `${JSON.stringify({ figures, timings }, null, 2)}\n`);
    const load = (await import('node:os')).loadavg()[0].toFixed(1);
    const idle = otherCores === null || otherCores < IDLE_OTHER_CORES;
    const otherText = otherCores === null ? 'other work not measurable (no /proc)' : `other work ${otherCores.toFixed(2)} cores`;
    console.log(
      `override → values painted, ${figures.breaths} breaths, ${figures.overrides} overrides: p95 ${figures.valuesP95Ms.toFixed(1)} ms (target ≤ 50), median ${figures.valuesMs.toFixed(1)} ms, max ${figures.valuesMaxMs.toFixed(1)} ms; ` +
        `worker ${figures.workerMs} ms, charts ${figures.chartsMs} ms; record after the values ${figures.recordMs} ms; load average ${load}, ${otherText}; ` +
        (idle ? 'requirement asserted' : `machine shared (other work ≥ ${IDLE_OTHER_CORES} cores): requirement NOT asserted, regression guard only`),
    );
    // What is timed (App.tsx): from the click on "Set" (the click event's own time) to the
    // first task after the frame that follows the commit of the new values (a frame callback,
    // then a message to the page): the values are painted by then. The charts take the new
    // view only after that, and the record (digest, case text) waits for it in the worker.
    expect(figures.overrides).toBeGreaterThanOrEqual(30);
    if (idle) {
      // The requirement (issue 14): override → values on screen at most 50 ms in 95 % of overrides.
      expect(figures.valuesP95Ms).toBeLessThanOrEqual(50);
    } else {
      // Not the requirement: a regression guard while other work shares the cores (the
      // figure above says what was measured and how loaded the machine was).
      expect(figures.valuesP95Ms).toBeLessThanOrEqual(400);
    }
    // The worker's share (the values, without the digest and case text) measured 4–10 ms, 30–44 ms with them: 20 ms keeps the digest off that path.
    expect(figures.workerMs).toBeLessThan(20);
    expect(figures.replyMs).toBeLessThanOrEqual(figures.valuesMs);

    // Autosave followed every change: the saved case is the newest, with the last time.
    await savedNote();
    const saved = await savedCase(N);
    // log[0] is the opening entry; reviewer entry k is log[k].
    const last = saved.caseFile.log[N].action;
    expect(last.kind === 'set-threshold' && last.after.timeS).toBe(Math.round(ramp.incrementalStartS + 300 + 10 * (N - 1)));
    expectRecordReproduced(saved);
  }, 400_000);

  it('undo withdraws the newest override, redo puts it back, withdraw needs a reason', async () => {
    const vt1Text = () => page.locator('[data-testid="row-vt1"] > :nth-child(2)').textContent();
    expect(await vt1Text()).toContain(`reviewer (entry ${N})`);
    await page.click('button[data-command="review.undo"]');
    // Undo withdraws entry N; entry N − 1 is in force again.
    await page.waitForFunction((seq) => document.querySelector('[data-testid="row-vt1"]')?.textContent?.includes(`reviewer (entry ${seq})`), N - 1);
    await page.keyboard.press('Control+Shift+Z');
    await page.waitForFunction((seq) => document.querySelector('[data-testid="row-vt1"]')?.textContent?.includes(`reviewer (entry ${seq})`), N + 2);
    const withdrawButton = page.locator('[data-testid="override-vt1"] button', { hasText: 'Withdraw' });
    expect(await withdrawButton.isDisabled()).toBe(true);
    await page.fill('[data-testid="override-vt1"] input', 'back to the automatic estimate for comparison');
    await withdrawButton.click();
    await page.waitForFunction((seq) => document.querySelector('[data-testid="row-vt1"]')?.textContent?.includes(`reviewer (entry ${seq})`), N - 1);
    await page.locator('nav.screens button', { hasText: 'Sign-off' }).click();
    // The opening entry, N overrides, the undo (N + 1), the redo (N + 2), the withdrawal (N + 3): the log only grows.
    expect(await page.locator('[data-testid="review-log"] li').count()).toBe(N + 4);
    await savedCase(N + 3);
  });

  it('an override and an undo in quick succession: both logged, the saved case is the newer', async () => {
    await page.locator('nav.screens button', { hasText: 'Breakpoints' }).click();
    await page.waitForSelector('[data-testid="override-apply"]');
    expect(await page.locator('button[data-command="review.redo"]').isDisabled()).toBe(true);
    const t = Math.round(pair.day2.truth.phases.incrementalStartS + 330);
    // The undo is sent in the same task as the override, long before the override's values,
    // record and save come back (tens of ms), so the two saves can race.
    await page.evaluate(async (timeS) => {
      const type = (selector: string, text: string) => {
        const field = document.querySelector(selector) as HTMLInputElement | HTMLTextAreaElement;
        Object.getOwnPropertyDescriptor(Object.getPrototypeOf(field), 'value')!.set!.call(field, text);
        field.dispatchEvent(new Event('input', { bubbles: true }));
      };
      type('[data-testid="override-value"]', String(timeS));
      type('[data-testid="override-reason"]', 'quick change, undone at once');
      // Lets React take the typed text before the click reads it.
      await new Promise((resolve) => setTimeout(resolve, 0));
      (document.querySelector('[data-testid="override-apply"]') as HTMLButtonElement).click();
      (document.querySelector('button[data-command="review.undo"]') as HTMLButtonElement).click();
    }, t);
    const saved = await savedCase(N + 5);
    const [set, undo] = saved.caseFile.log.slice(N + 4).map((e) => e.action);
    expect(set.kind === 'set-threshold' && set.after.timeS).toBe(t);
    expect(undo.kind === 'withdraw' && undo.withdraws).toBe(N + 4);
    expect(saved.caseFile.log[N + 5].reason).toBe('undo');
    // The screen shows the undo's view: entry N − 1 in force again, the undone override redoable.
    await page.waitForFunction(() => !(document.querySelector('button[data-command="review.redo"]') as HTMLButtonElement | null)?.disabled);
    expect(await page.locator('[data-testid="row-vt1"] > :nth-child(2)').textContent()).toContain(`reviewer (entry ${N - 1})`);
    await savedNote();
    // Nothing older lands afterwards.
    await new Promise((resolve) => setTimeout(resolve, 500));
    const after = loadCase(saved.path);
    expect(after.ok && after.value.caseFile.log.length).toBe(N + 6);
    expectRecordReproduced(saved);
    await page.screenshot({ path: join(SCREENSHOTS, '9-quick-change-saved.png'), fullPage: true });
  });
});

describe('an export whose units the importer inferred', () => {
  it('asks about the columns, remembers the answer for the layout, and does not ask again', async () => {
    const utf16 = readFileSync(join(ROOT, 'sample-tests', 'layouts', 'quoted-utf16', 'qh0417-day1.csv'));
    const day2 = readFileSync(join(DEMO_FOLDER, DEMO_PAIR.day2));
    const start = async () => {
      await page.locator('nav.screens button', { hasText: 'Intake' }).click();
      await page.setInputFiles('[data-testid="day1-file"]', { name: 'cart-export.csv', mimeType: 'text/csv', buffer: utf16 });
      await page.setInputFiles('[data-testid="day2-file"]', { name: DEMO_PAIR.day2, mimeType: 'text/csv', buffer: day2 });
      await page.click('text=Start case');
    };
    await start();
    await page.waitForSelector('[data-testid="mapping-step"]', { timeout: 120_000 });
    const text = await page.locator('[data-testid="mapping-step"]').textContent();
    // The importer inferred two units in this layout (warnings 'unit-inferred').
    expect(text).toContain('gives no unit');
    expect(await page.locator('.mapping-table tbody tr').count()).toBeGreaterThan(0);
    await page.screenshot({ path: join(SCREENSHOTS, '8-mapping-step.png'), fullPage: true });
    await page.click('text=Use these columns and remember them for this layout');
    await page.waitForSelector('[data-testid="thresholds-day1"], .error-notice', { timeout: 120_000 });
    expect(await page.locator('.error-notice').allTextContents()).toEqual([]);

    await start();
    await page.waitForSelector('[data-testid="thresholds-day1"], [data-testid="mapping-step"]', { timeout: 120_000 });
    expect(await page.locator('[data-testid="mapping-step"]').count()).toBe(0);
  }, 150_000);

  it('made no request outside 127.0.0.1', () => {
    expect(bench.outside).toEqual([]);
  });
});
