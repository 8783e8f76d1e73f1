/**
 * The workbench's heavy jobs as named tasks with plain-data inputs and outputs, so they can
 * run in a worker thread (off-thread.ts): verifying a report, building (and signing) a
 * report from a case folder, and the unsigned preview. Each is the same code the command
 * line runs (host/verify-report.ts, host/report-job.ts).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { LocatedError } from '../../core/model/errors';
import type { TrustAnchor } from '../../core/report/trust';
import { loadCase } from '../case-folder';
import { runReportJob, type Certificate } from '../report-job';
import { verifyReport, type VerifyOutcome } from '../verify-report';

export type TaskResult<T> = { ok: true; value: T } | { ok: false; error: LocatedError };

export interface VerifyTaskInput {
  readonly bytes: Uint8Array;
  readonly fileName: string;
  readonly trust: readonly TrustAnchor[];
}

export interface ReportTaskInput {
  readonly folder: string;
  /** Where the PDF goes; null: a preview, built in a scratch folder and returned. */
  readonly outPath: string | null;
  readonly reviewer: string | null;
  readonly certificate: Certificate | null;
  readonly nowIso: string;
}

async function verifyTask(input: VerifyTaskInput): Promise<VerifyOutcome> {
  return verifyReport(new Uint8Array(input.bytes), input.fileName, { trust: input.trust });
}

async function reportTask(input: ReportTaskInput): Promise<TaskResult<{ bytes: number; pdf: Uint8Array | null }>> {
  const loaded = loadCase(input.folder);
  if (!loaded.ok) return loaded;
  const scratch = input.outPath === null ? mkdtempSync(join(tmpdir(), 'twofold-preview-')) : null;
  try {
    const outPath = input.outPath ?? join(scratch!, 'preview-unsigned.pdf');
    const job = await runReportJob({ caseFile: loaded.value.caseFile, raw: loaded.value.raw, caseFolder: input.folder, outPath, reviewer: input.reviewer, certificate: input.certificate, now: new Date(input.nowIso) });
    if (!job.ok) return job;
    return { ok: true, value: { bytes: job.value.bytes, pdf: scratch ? new Uint8Array(readFileSync(outPath)) : null } };
  } finally {
    if (scratch) rmSync(scratch, { recursive: true, force: true });
  }
}

export const TASKS = { verify: verifyTask, report: reportTask } as const;
export type TaskName = keyof typeof TASKS;
