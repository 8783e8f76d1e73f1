/**
 * Runs `verifyReport` in a worker thread with a time limit. The request thread only waits
 * for a message, so the workbench keeps answering other requests (listing cases, opening
 * one) while a report is checked; a verification that runs past the limit is stopped
 * (Worker.terminate ends even a busy loop) and reported as not verified.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { TrustAnchor } from '../../core/report/trust';
import { verifyReport, type VerifyOutcome } from '../verify-report';

const THREAD = fileURLToPath(new URL('./verify-thread.mjs', import.meta.url));

/** Default limit for one verification, ms: a 1M-breath pair verifies in well under this (docs/performance.md). */
export const VERIFY_TIME_LIMIT_MS = 180_000;

export function verifyOffThread(bytes: Uint8Array, fileName: string, trust: readonly TrustAnchor[], limitMs = VERIFY_TIME_LIMIT_MS): Promise<VerifyOutcome> {
  // A build that does not ship the thread file (a bundled main process) verifies in line.
  if (!existsSync(THREAD)) return verifyReport(bytes, fileName, { trust });
  return new Promise((resolve) => {
    const worker = new Worker(THREAD, { workerData: { bytes, fileName, trust: [...trust] } });
    const stop = (what: string) => resolve({ passed: false, untrustedOnly: false, steps: [{ ok: false, what }] });
    const timer = setTimeout(() => {
      void worker.terminate();
      stop(`Verification stopped after ${Math.round(limitMs / 1000)} s without finishing; the report was not verified (a report whose settings demand more work than this is refused).`);
    }, limitMs);
    worker.once('message', (m: { ok: true; outcome: VerifyOutcome } | { ok: false; message: string }) => {
      clearTimeout(timer);
      void worker.terminate();
      if (m.ok) resolve(m.outcome);
      else stop(`Verification stopped with an internal error: ${m.message}`);
    });
    worker.once('error', (error) => {
      clearTimeout(timer);
      stop(`Verification stopped with an internal error: ${error.message}`);
    });
  });
}
