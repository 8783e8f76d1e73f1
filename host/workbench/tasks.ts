/**
 * The workbench's heavy jobs as named tasks with plain-data inputs and outputs, so they can
 * run in a worker thread (off-thread.ts): verifying a report, building (and signing) a
 * report from a case folder, and the unsigned preview. Each is the same code the command
 * line runs (host/verify-report.ts, host/report-job.ts).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { CaseFile } from '../../core/case/case-file';
import { resolveLocale } from '../../core/locale/locales';
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
  /** The number and date format the workbench asked for; absent keeps the case's own. */
  readonly locale?: string;
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
    const job = await runReportJob({ caseFile: withLocale(loaded.value.caseFile, input.locale), raw: loaded.value.raw, caseFolder: input.folder, outPath, reviewer: input.reviewer, certificate: input.certificate, now: new Date(input.nowIso) });
    if (!job.ok) return job;
    return { ok: true, value: { bytes: job.value.bytes, pdf: scratch ? new Uint8Array(readFileSync(outPath)) : null } };
  } finally {
    if (scratch) rmSync(scratch, { recursive: true, force: true });
  }
}

/** The case with the report locale the workbench asked for (an unknown tag keeps the case's). */
function withLocale(caseFile: CaseFile, tag: string | undefined): CaseFile {
  const locale = tag === undefined ? null : resolveLocale(tag);
  return locale ? { ...caseFile, reportLocale: locale.tag } : caseFile;
}

export const TASKS = { verify: verifyTask, report: reportTask } as const;
export type TaskName = keyof typeof TASKS;
