/**
 * The page's side of the analysis worker: one promise per request, settled by its view (or
 * error, or mapping question); progress, and the record that follows a view, on the side.
 */
import type { CaseRecord, EngineReply, EngineRequest, EngineView, PageShown, WireReply, WireView } from './protocol';
import { applyPatch } from './view-patch';
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
  // The view as last received: the worker sends each next view as a patch against it.
  let received: EngineView<C> | null = null;
  const whole = (patch: WireView): EngineView<C> => {
    const view = applyPatch(received, patch);
    if (!view) throw new Error('the analysis worker sent a change to a view the page never received');
    received = view;
    return view;
  };
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
    /** Tells the worker the values of `revision` are painted, so it records them now. */
    shown(revision: number): void {
      const message: PageShown = { type: 'shown', revision };
      worker.postMessage({ id: 0, message });
    },
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
