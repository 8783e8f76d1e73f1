/** The page's side of the analysis worker: one promise per request, progress on the side. */
import type { EngineReply, EngineRequest } from './protocol';

export type Settled<C> = Exclude<EngineReply<C>, { type: 'progress' }>;

export function startEngine<C>(onProgress: (stage: string, fraction: number) => void) {
  const worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'twofold-engine' });
  let next = 1;
  const pending = new Map<number, (reply: Settled<C>) => void>();
  worker.addEventListener('message', (event: MessageEvent<EngineReply<C>>) => {
    const reply = event.data;
    if (reply.type === 'progress') return onProgress(reply.stage, reply.fraction);
    pending.get(reply.id)?.(reply);
    pending.delete(reply.id);
  });
  worker.addEventListener('error', (event) => {
    for (const [id, settle] of pending) settle({ id, type: 'error', error: { code: 'worker-failed', file: 'analysis worker', line: event.lineno || null, column: event.colno || null, message: `The analysis stopped unexpectedly: ${event.message}` } });
    pending.clear();
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
