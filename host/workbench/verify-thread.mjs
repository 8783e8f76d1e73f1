// The worker thread that verifies one report for the workbench (verify-worker.ts), so a
// long or hostile verification never holds the server's request thread. It loads the
// TypeScript sources through tsx, as bin/twofold.mjs does, verifies, posts the outcome.
import { parentPort, workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { verifyReport } = await import('../verify-report.ts');
const { bytes, fileName, trust } = workerData;
try {
  parentPort.postMessage({ ok: true, outcome: await verifyReport(new Uint8Array(bytes), fileName, { trust }) });
} catch (error) {
  parentPort.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error) });
}
