/**
 * The analysis worker: holds the open case and runs core on it, so the page never freezes.
 * Every number it sends back was computed by core (import, analyzeTest, compareTests,
 * recomputeCase, the review functions); this file only sequences them and keeps the case.
 *
 * Undo withdraws the newest override still in force (a logged withdrawal, reason "undo");
 * redo records that override again with its first reason. The log only ever grows.
 *
 * A change is answered with its view as soon as the values are computed, and then with its
 * record: the digest of the whole result and the case text to autosave. Those two take most of
 * the recompute's time and the screen does not need them, so they wait until the page reports
 * the values painted ('shown'), at the latest `RECORD_WAIT_MS`, and always run before the next
 * request is handled (no later request can come between a change and its record). On a
 * machine whose cores are busy, the digest then does not compete with the page's paint. A
 * change becomes the open case only once recorded.
 */
/// <reference lib="webworker" />
import { columnMapOf, type CaseFile, type DayNumber } from '../../../core/case/case-file';
import { withColumnMaps } from '../../../core/case/new-case';
import { caseFromText, caseToText } from '../../../core/case/case-text';
import { recomputeCase, recomputeValues, recordResults, type CaseOutcome, type CaseValues, type RawBytes } from '../../../core/case/recompute';
import { recordOverride, recordWithdrawal, recordSignOff } from '../../../core/case/review';
import { activeOverrides } from '../../../core/case/overrides';
import { recordFollowUp, recordFollowUpCorrection } from '../../../core/case/follow-ups';
import { reviewerEntries } from '../../../core/case/opening';
import { locatedError, ok, type LocatedError } from '../../../core/model/errors';
import type { Comparison } from '../../../core/compare/compare-tests';
import { parseMapping, type ColumnMapping } from '../../../core/import/mapping';
import type { ImportResult } from '../../../core/import/types';
import { workbenchEngine, layoutKeyOf, mappingQuestion, needsMapping, type WorkbenchEngine } from './core-engine';
import type { CaseRecord, DayImportNotes, EngineReply, EngineRequest, EngineView, PageShown, Reviewer, WireReply, WireView } from './protocol';
import { diffValue } from './view-patch';

declare const self: DedicatedWorkerGlobalScope;

interface RedoItem {
  readonly day: DayNumber;
  readonly threshold: 'vt1' | 'vt2';
  readonly timeS: number;
  readonly reason: string;
}

interface OpenCase {
  readonly caseId: string;
  readonly revision: number;
  caseFile: CaseFile;
  raw: RawBytes;
  mappings: ReadonlyMap<string, ColumnMapping>;
  engine: WorkbenchEngine;
  outcome: CaseOutcome<Comparison>;
  imports: { day1: ImportResult; day2: ImportResult };
  /** Overrides undone, newest last: what redo puts back. */
  redo: readonly RedoItem[];
}

let open: OpenCase | null = null;
/** The newest revision given out; never reused, so a record names one state of one case. */
let revisions = 0;

function bytesOf(base64: string): Uint8Array {
  const text = atob(base64);
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
  return bytes;
}

/** The view last posted: the page holds its copy, so the next view is sent as a patch against it. */
let posted: EngineView<Comparison> | null = null;

function wireView(view: EngineView<Comparison>): WireView {
  const patch = diffValue(posted, view);
  posted = view;
  return patch;
}

function post(reply: EngineReply<Comparison>): void {
  const wire: WireReply<Comparison> = reply.type === 'view' || reply.type === 'record-failed' ? { ...reply, view: wireView(reply.view) } : reply;
  self.postMessage(wire);
}

function notesOf(result: ImportResult): DayImportNotes {
  return { warnings: result.warnings, rejected: result.rejected, flagged: result.flags.length };
}

type ViewState = Pick<OpenCase, 'revision' | 'caseFile' | 'imports' | 'redo'> & { values: CaseValues<Comparison> };

function viewOf(state: ViewState, updateMs: number): EngineView<Comparison> {
  return {
    day1: state.values.day1,
    day2: state.values.day2,
    comparison: state.values.comparison,
    notes: { day1: notesOf(state.imports.day1), day2: notesOf(state.imports.day2) },
    log: state.caseFile.log,
    revision: state.revision,
    redoable: state.redo.length,
    updateMs,
  };
}

/** The state's record; `recordMs` runs from `startedMs` to the case text written. */
function recordOf(state: OpenCase, startedMs: number): CaseRecord {
  const caseJson = caseToText({ ...state.caseFile, recorded: state.outcome.recorded });
  return { caseId: state.caseId, revision: state.revision, digest: state.outcome.recorded.digest, caseJson, recordMs: performance.now() - startedMs };
}

async function handleOpen(id: number, message: Extract<EngineRequest, { type: 'open' }>): Promise<void> {
  post({ id, type: 'progress', stage: 'Reading the case file', fraction: 0.05 });
  const parsed = caseFromText(message.caseJson, 'twofold-case.json');
  if (!parsed.ok) return post({ id, type: 'error', error: parsed.error });
  const mappings = new Map<string, ColumnMapping>();
  for (const m of message.mappings) {
    const mapping = parseMapping(m.mappingJson, `${m.layoutKey}.json`);
    if (mapping.ok) mappings.set(m.layoutKey, mapping.value);
  }
  const raw = { day1: bytesOf(message.day1.base64), day2: bytesOf(message.day2.base64) };
  const names = { day1: parsed.value.inputs.day1.name, day2: parsed.value.inputs.day2.name };
  // Each day is read with the column map its case records (core/case/new-case.ts). While the
  // reviewer log is empty (nothing is chained to the inputs yet), a day without one takes the
  // map remembered for its layout, and the case records it; after that the maps stand.
  const reviewed = reviewerEntries(parsed.value.log).length > 0;
  const probe = workbenchEngine(new Map());
  const plain: Partial<Record<'day1' | 'day2', ImportResult>> = {};
  const columnMaps: Record<'day1' | 'day2', ColumnMapping | null> = { day1: null, day2: null };
  for (const day of [1, 2] as const) {
    const key = day === 1 ? 'day1' : 'day2';
    post({ id, type: 'progress', stage: `Importing day ${day} (${names[key]})`, fraction: day === 1 ? 0.1 : 0.3 });
    const result = await probe.preload(names[key], raw[key], parsed.value.settings);
    if (!result.ok) return post({ id, type: 'error', error: result.error });
    const recorded = columnMapOf(parsed.value.inputs[key]);
    const remembered = reviewed ? null : (mappings.get(layoutKeyOf(result.value)) ?? null);
    if (!recorded && !remembered && !reviewed && needsMapping(result.value)) {
      return post({ id, type: 'needs-mapping', question: mappingQuestion(day, names[key], raw[key], result.value) });
    }
    plain[key] = result.value;
    columnMaps[key] = recorded ?? remembered;
  }
  const withMaps = reviewed ? ok(parsed.value) : withColumnMaps(parsed.value, columnMaps, 'twofold-case.json');
  if (!withMaps.ok) return post({ id, type: 'error', error: withMaps.error });
  const caseFile = withMaps.value;
  const layoutKeys = { day1: layoutKeyOf(plain.day1!), day2: layoutKeyOf(plain.day2!) };
  // The workbench's engine applies one map per layout.
  if (layoutKeys.day1 === layoutKeys.day2 && JSON.stringify(columnMaps.day1) !== JSON.stringify(columnMaps.day2)) {
    return post({ id, type: 'error', error: locatedError('column-maps-one-layout', 'twofold-case.json', null, null, 'Both days share one export layout, but the case reads them with different column maps, which the workbench cannot do; `twofold report` can still recompute this case.') });
  }
  const mapped = new Map<string, ColumnMapping>();
  for (const key of ['day1', 'day2'] as const) {
    const map = columnMaps[key];
    if (map) mapped.set(layoutKeys[key], map);
  }
  const engine = mapped.size === 0 ? probe : workbenchEngine(mapped);
  const imports: Partial<Record<'day1' | 'day2', ImportResult>> = {};
  for (const key of ['day1', 'day2'] as const) {
    const result = engine === probe ? ok(plain[key]!) : await engine.preload(names[key], raw[key], caseFile.settings);
    if (!result.ok) return post({ id, type: 'error', error: result.error });
    imports[key] = result.value;
  }
  post({ id, type: 'progress', stage: 'Analysing both days (thresholds, bootstrap, comparison)', fraction: 0.5 });
  const started = performance.now();
  // Opening is not on the path from a change to the screen: recorded before it is shown.
  const done = recomputeCase(caseFile, raw, engine);
  if (!done.ok) return post({ id, type: 'error', error: done.error });
  const state: OpenCase = { caseId: message.caseId, revision: ++revisions, caseFile, raw, mappings, engine, outcome: done.value, imports: { day1: imports.day1!, day2: imports.day2! }, redo: [] };
  open = state;
  const updateMs = performance.now() - started;
  post({ id, type: 'view', view: viewOf({ ...state, values: state.outcome }, updateMs) });
  post({ id, type: 'record', record: recordOf(state, performance.now()) });
  warmChangePath(state);
}

/**
 * Dry runs of an override, after a case opens: the first two or three changes in a fresh
 * worker ran at 35–40 ms against 6–13 ms later (the script engine had not yet compiled the
 * recompute path), which put the first overrides of a session outside the frame budget. Each
 * run appends an override of VT1 at its own time to a copy of the case and recomputes the
 * values; nothing is posted, kept or saved. One run per task, so a request that arrives
 * meanwhile is handled before the next run, and none once another case is open.
 */
const WARM_RUNS = 3;
function warmChangePath(state: OpenCase, left = WARM_RUNS): void {
  if (left <= 0) return;
  setTimeout(() => {
    if (open?.caseId !== state.caseId) return;
    const day = left % 2 === 0 ? 1 : 2;
    const at = (day === 1 ? state.outcome.day1 : state.outcome.day2).vt1.effective;
    if (!at) return;
    const next = recordOverride(state.caseFile, state.outcome, { who: 'warm-up', role: 'none', at: new Date(0).toISOString() }, day, 'vt1', { timeS: at.timeS }, 'warm-up');
    if (next.ok) recomputeValues(next.value, state.raw, state.engine);
    warmChangePath(state, left - 1);
  }, 0);
}

/**
 * Appends one reviewed action (built by `change`), recomputes, posts the view (its timing
 * covers the action and the values), then records the new state and posts the record. A
 * state whose results cannot be recorded is dropped: the page gets the previous view back.
 */
function applyChange(id: number, change: (state: OpenCase) => { ok: true; value: CaseFile } | { ok: false; error: LocatedError }, redoAfter: (state: OpenCase) => readonly RedoItem[] = (s) => s.redo, sameValues = false): void {
  const state = open;
  if (!state) return post({ id, type: 'error', error: { code: 'no-case', file: 'workbench', line: null, column: null, message: 'Open a case first.' } });
  const started = performance.now();
  const next = change(state);
  if (!next.ok) return post({ id, type: 'error', error: next.error });
  // A follow-up changes no analysed value (sameValues), only what is recorded with them.
  const values = sameValues ? ok<CaseValues<Comparison>>(state.outcome) : recomputeValues(next.value, state.raw, state.engine);
  if (!values.ok) return post({ id, type: 'error', error: values.error });
  const changed = { revision: ++revisions, caseFile: next.value, redo: redoAfter(state) };
  post({ id, type: 'view', view: viewOf({ ...changed, imports: state.imports, values: values.value }, performance.now() - started) });

  deferRecord(() => {
    const recordStarted = performance.now();
    const recorded = recordResults(values.value, next.value.log);
    if (!recorded.ok) return post({ id, type: 'record-failed', error: recorded.error, view: viewOf({ ...state, values: state.outcome }, performance.now() - started) });
    const kept: OpenCase = { ...state, ...changed, outcome: { ...values.value, recorded: recorded.value } };
    open = kept;
    post({ id, type: 'record', record: recordOf(kept, recordStarted) });
  });
}

/** The longest a change's record waits for the page to report its values painted, ms (our choice: a hidden page paints nothing). */
export const RECORD_WAIT_MS = 100;
let pendingRecord: { run: () => void; timer: ReturnType<typeof setTimeout> } | null = null;

function deferRecord(run: () => void): void {
  recordNow();
  pendingRecord = { run, timer: setTimeout(recordNow, RECORD_WAIT_MS) };
}

/** Records the change waiting for its record, if any. */
function recordNow(): void {
  const pending = pendingRecord;
  if (!pending) return;
  pendingRecord = null;
  clearTimeout(pending.timer);
  pending.run();
}

const stamp = (reviewer: Reviewer, at: string) => ({ who: reviewer.who, role: reviewer.role, at });

function handle(id: number, message: EngineRequest): void {
  switch (message.type) {
    case 'open':
      handleOpen(id, message).catch((error: unknown) => crashed(id, error));
      return;
    case 'set-threshold':
      return applyChange(
        id,
        (s) => recordOverride(s.caseFile, s.outcome, stamp(message.reviewer, message.at), message.day, message.threshold, message.givenAs === 'time' ? { timeS: message.value } : { vo2MlMin: message.value }, message.reason),
        () => [],
      );
    case 'withdraw':
      return applyChange(id, (s) => recordWithdrawal(s.caseFile, s.outcome, stamp(message.reviewer, message.at), message.seq, message.reason));
    case 'undo': {
      const newest = open ? [...activeOverrides(open.caseFile.log).values()].sort((a, b) => b.seq - a.seq)[0] : undefined;
      if (!newest) return post({ id, type: 'error', error: { code: 'nothing-to-undo', file: 'reviewer log', line: null, column: null, message: 'There is no threshold change in force to undo.' } });
      return applyChange(
        id,
        (s) => recordWithdrawal(s.caseFile, s.outcome, stamp(message.reviewer, message.at), newest.seq, 'undo'),
        (s) => [...s.redo, { day: newest.day, threshold: newest.threshold, timeS: newest.point.timeS, reason: newest.reason }],
      );
    }
    case 'follow-up':
      return applyChange(id, (s) => recordFollowUp(s.caseFile, stamp(message.reviewer, message.at), message.report, message.reason), undefined, true);
    case 'follow-up-correction':
      return applyChange(id, (s) => recordFollowUpCorrection(s.caseFile, stamp(message.reviewer, message.at), message.seq, message.report, message.reason), undefined, true);
    case 'sign-off':
      return applyChange(id, (s) => recordSignOff(s.caseFile, stamp(message.reviewer, message.at), message.statement, 'Signed off on the Sign-off screen.'));
    case 'redo': {
      const item = open?.redo[open.redo.length - 1];
      if (!item) return post({ id, type: 'error', error: { code: 'nothing-to-redo', file: 'reviewer log', line: null, column: null, message: 'There is no undone threshold change to redo.' } });
      return applyChange(
        id,
        (s) => recordOverride(s.caseFile, s.outcome, stamp(message.reviewer, message.at), item.day, item.threshold, { timeS: item.timeS }, item.reason),
        (s) => s.redo.slice(0, -1),
      );
    }
  }
}

function crashed(id: number, error: unknown): void {
  post({ id, type: 'error', error: { code: 'analysis-crashed', file: 'analysis worker', line: null, column: null, message: `The analysis failed unexpectedly: ${error instanceof Error ? error.message : String(error)}` } });
}

self.addEventListener('message', (event: MessageEvent<{ id: number; message: EngineRequest | PageShown }>) => {
  const { id, message } = event.data;
  try {
    // A waiting record comes first: the page has painted its values, or a new request needs the recorded case.
    recordNow();
    if (message.type !== 'shown') handle(id, message);
  } catch (error) {
    crashed(id, error);
  }
});
