// A worker thread for the workbench's heavy jobs (off-thread.ts): loads the TypeScript
// sources through tsx, as bin/twofold.mjs does, runs one named task with plain-data
// arguments and posts its result. Only the tasks in tasks.ts can be named.
import { parentPort, workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { TASKS } = await import('./tasks.ts');
const { task, input } = workerData;
try {
  const run = TASKS[task];
  if (!run) throw new Error(`no task called ${task}`);
  parentPort.postMessage({ ok: true, value: await run(input) });
} catch (error) {
  parentPort.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error) });
}
