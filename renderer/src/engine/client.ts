/**
 * The page's side of the analysis worker: one promise per request, settled by its view (or
 * error, or mapping question); progress, and the record that follows a view, on the side.
 */
import type { CaseRecord, EngineReply, EngineRequest, EngineView, WireDay, WireReply, WireView } from './protocol';
import type { DayOutcome } from '../../../core/case/recompute';
import type { ProcessedSeries } from '../../../core/model/analysis';
import type { LocatedError } from '../../../core/model/errors';

type Aside = 'progress' | 'record' | 'record-failed';
export type Settled<C> = Exclude<EngineReply<C>, { type: Aside }>;

export interface EngineListeners<C> {
  readonly onProgress: (stage: string, fraction: number) => void;
  /** A view's record (digest and case text to autosave), after that view's request settled. */
  readonly onRecord: (record: CaseRecord) => void;
  /** A change whose results could not be recorded was dropped; the case is back at `view`. */
  readonly onRecordFailed: (error: LocatedError, view: EngineView<C>) => void;
  /** The worker stopped: no record will follow. */
  readonly onStopped: () => void;
}

export function startEngine<C>(listeners: EngineListeners<C>) {
  const worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'twofold-engine' });
  let next = 1;
  const pending = new Map<number, (reply: Settled<C>) => void>();
  // Each day's series as last received: the worker leaves out one that has not changed.
  const series: { day1: ProcessedSeries | null; day2: ProcessedSeries | null } = { day1: null, day2: null };
  const wholeDay = (key: 'day1' | 'day2', day: WireDay): DayOutcome => {
    if (day.analysis.series) series[key] = day.analysis.series;
    if (!series[key]) throw new Error('the analysis worker left out a series the page never received');
    return { ...day, analysis: { ...day.analysis, series: series[key] } };
  };
  const whole = (view: WireView<C>): EngineView<C> => ({ ...view, day1: wholeDay('day1', view.day1), day2: wholeDay('day2', view.day2) });
  worker.addEventListener('message', (event: MessageEvent<WireReply<C>>) => {
    const wire = event.data;
    const reply: EngineReply<C> = wire.type === 'view' || wire.type === 'record-failed' ? { ...wire, view: whole(wire.view) } : wire;
    if (reply.type === 'progress') return listeners.onProgress(reply.stage, reply.fraction);
    if (reply.type === 'record') return listeners.onRecord(reply.record);
    if (reply.type === 'record-failed') return listeners.onRecordFailed(reply.error, reply.view);
    pending.get(reply.id)?.(reply);
    pending.delete(reply.id);
  });
  worker.addEventListener('error', (event) => {
    for (const [id, settle] of pending) settle({ id, type: 'error', error: { code: 'worker-failed', file: 'analysis worker', line: event.lineno || null, column: event.colno || null, message: `The analysis stopped unexpectedly: ${event.message}` } });
    pending.clear();
    listeners.onStopped();
  });
  return {
    request(message: EngineRequest): Promise<Settled<C>> {
      const id = next++;
      return new Promise((resolve) => {
        pending.set(id, resolve);
        worker.postMessage({ id, message });
      });
    },
  };
}

export type EngineClient<C> = ReturnType<typeof startEngine<C>>;
