/**
 * Messages between the page and its analysis worker. The worker owns the case file and the
 * core engine; the page sends intents and receives whole views to draw.
 *
 * Each state of the case has a revision number, increasing across the worker's life. A
 * change is answered in two messages: first its view (the values to draw, as a patch of what
 * changed), then its record
 * (digest and case text, to autosave). The revision ties a record to its view, and lets
 * autosave refuse a case text older than one it has already written.
 */
import type { FilePayload } from '../../../host/workbench/api';
import type { LocatedError } from '../../../core/model/errors';
import type { ThresholdId } from '../../../core/model/analysis';
import type { AuditEntry, DayNumber } from '../../../core/case/case-file';
import type { DayOutcome } from '../../../core/case/recompute';
import type { Patch } from './view-patch';

export interface Reviewer {
  readonly who: string;
  readonly role: string;
}

/** A column the importer was unsure of, for the mapping step. */
export interface MappingQuestion {
  readonly day: DayNumber;
  readonly fileName: string;
  readonly layoutKey: string;
  readonly headers: readonly string[];
  /** The first rows under the header, cell by cell, as written. */
  readonly rows: readonly (readonly string[])[];
  /** The importer's reading of each column, index-aligned with `headers`. */
  readonly columns: readonly { readonly variable: string | null; readonly unit: string | null; readonly unitInferred: boolean; readonly note: string | null }[];
  readonly warnings: readonly LocatedError[];
  /** Variables and the units each accepts, from the importer. */
  readonly choices: readonly { readonly variable: string; readonly label: string; readonly units: readonly string[] }[];
}

export interface DayImportNotes {
  readonly warnings: readonly LocatedError[];
  readonly rejected: readonly LocatedError[];
  readonly flagged: number;
}

export interface EngineView<C = unknown> {
  readonly day1: DayOutcome;
  readonly day2: DayOutcome;
  readonly comparison: C;
  readonly notes: { readonly day1: DayImportNotes; readonly day2: DayImportNotes };
  readonly log: readonly AuditEntry[];
  /** The case state these values belong to. */
  readonly revision: number;
  /** Overrides withdrawn by undo that redo can put back, newest last. */
  readonly redoable: number;
  /** Wall time in the worker from the request to these values, ms. */
  readonly updateMs: number;
}

/**
 * A view as the worker sends it: only what changed. The worker posts a patch of the view
 * against the one it posted before (view-patch.ts), and the page's client applies it to its
 * copy (client.ts): an override sends the moved threshold's values, the comparison rows that
 * changed, the new log entry and the counters, not both days' analyses again.
 */
export type WireView = Patch | null;
/** A case state's recorded form: what autosave writes, posted after the view of the same revision. */
export interface CaseRecord {
  /** The shell's name for the case, as given when it was opened. */
  readonly caseId: string;
  readonly revision: number;
  /** SHA-256 of every recomputed number (core/case `recorded.digest`). */
  readonly digest: string;
  /** The case file, with its recorded results, as text to save. */
  readonly caseJson: string;
  /** Wall time in the worker to record it after its view (digest and case text), ms; for an opened case, the case text alone. */
  readonly recordMs: number;
}

export type EngineRequest =
  | { readonly type: 'open'; readonly caseId: string; readonly day1: FilePayload; readonly day2: FilePayload; readonly caseJson: string; readonly mappings: readonly { layoutKey: string; mappingJson: string }[] }
  | { readonly type: 'set-threshold'; readonly day: DayNumber; readonly threshold: ThresholdId; readonly givenAs: 'time' | 'vo2'; readonly value: number; readonly reason: string; readonly reviewer: Reviewer; readonly at: string }
  | { readonly type: 'withdraw'; readonly seq: number; readonly reason: string; readonly reviewer: Reviewer; readonly at: string }
  | { readonly type: 'undo'; readonly reviewer: Reviewer; readonly at: string }
  | { readonly type: 'redo'; readonly reviewer: Reviewer; readonly at: string }
  // Follow-up reports (core/case/follow-ups.ts): the report is checked by core in the worker.
  | { readonly type: 'follow-up'; readonly report: unknown; readonly reason: string; readonly reviewer: Reviewer; readonly at: string }
  | { readonly type: 'follow-up-correction'; readonly seq: number; readonly report: unknown | null; readonly reason: string; readonly reviewer: Reviewer; readonly at: string }
  /** A sign-off entry in the reviewer log (core/case/review.ts `recordSignOff`). */
  | { readonly type: 'sign-off'; readonly statement: string; readonly reviewer: Reviewer; readonly at: string };

/** The page has painted the values of `revision`: the worker may now record them (engine.worker.ts). Not answered. */
export interface PageShown {
  readonly type: 'shown';
  readonly revision: number;
}

/** A reply as the page sees it (views whole). */
export type EngineReply<C = unknown> =
  | { readonly id: number; readonly type: 'view'; readonly view: EngineView<C> }
  | { readonly id: number; readonly type: 'needs-mapping'; readonly question: MappingQuestion }
  | { readonly id: number; readonly type: 'error'; readonly error: LocatedError }
  | { readonly id: number; readonly type: 'progress'; readonly stage: string; readonly fraction: number }
  /** Follows the request's view. */
  | { readonly id: number; readonly type: 'record'; readonly record: CaseRecord }
  /**
   * Follows the request's view when its results could not be recorded: the change is not
   * kept, and the case is back at `view` (the previous revision, already recorded).
   */
  | { readonly id: number; readonly type: 'record-failed'; readonly error: LocatedError; readonly view: EngineView<C> };

/** A reply as the worker posts it: views carry only what changed (WireView). */
export type WireReply<C = unknown> =
  | Exclude<EngineReply<C>, { type: 'view' | 'record-failed' }>
  | { readonly id: number; readonly type: 'view'; readonly view: WireView }
  | { readonly id: number; readonly type: 'record-failed'; readonly error: LocatedError; readonly view: WireView };
