/**
 * Runs a workbench task (tasks.ts) in a worker thread with a time limit. The request thread
 * only waits for a message, so the workbench keeps answering other requests (listing
 * cases, opening one) while a report is verified or built; a task that runs past its limit
 * is stopped (Worker.terminate ends even a busy loop) and reported as stopped.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { TASKS, type TaskName } from './tasks';

const THREAD = fileURLToPath(new URL('./job-thread.mjs', import.meta.url));

/** Default limit of one verification or report build, ms. */
export const TASK_TIME_LIMIT_MS = 180_000;

export type OffThread<T> = { done: true; value: T } | { done: false; why: string };

export function runOffThread<N extends TaskName>(task: N, input: Parameters<(typeof TASKS)[N]>[0], limitMs = TASK_TIME_LIMIT_MS): Promise<OffThread<Awaited<ReturnType<(typeof TASKS)[N]>>>> {
  type Value = Awaited<ReturnType<(typeof TASKS)[N]>>;
  // A build that does not ship the thread file (a bundled main process) runs the task in line.
  if (!existsSync(THREAD)) return (TASKS[task] as (i: typeof input) => Promise<Value>)(input).then((value) => ({ done: true, value }));
  return new Promise((resolve) => {
    const worker = new Worker(THREAD, { workerData: { task, input } });
    const timer = setTimeout(() => {
      void worker.terminate();
      resolve({ done: false, why: `stopped after ${Math.round(limitMs / 1000)} s without finishing` });
    }, limitMs);
    worker.once('message', (m: { ok: true; value: Value } | { ok: false; message: string }) => {
      clearTimeout(timer);
      void worker.terminate();
      resolve(m.ok ? { done: true, value: m.value } : { done: false, why: `stopped with an internal error: ${m.message}` });
    });
    worker.once('error', (error) => {
      clearTimeout(timer);
      resolve({ done: false, why: `stopped with an internal error: ${error.message}` });
    });
  });
}
