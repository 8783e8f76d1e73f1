/**
 * The report job shared by `twofold report` and `twofold demo`: open or create the case,
 * recompute it (each raw file read with the column map the case records for it, so the
 * report shows what the workbench showed), save the case folder atomically, build the PDF,
 * sign it if asked, and write it atomically. File reading, the clock and the certificate
 * come in from here; every computation is a core function.
 */
import { basename } from 'node:path';
import type { CaseFile } from '../core/case/case-file';
import { caseToText } from '../core/case/case-text';
import { recomputeCase, type CaseOutcome, type RawBytes } from '../core/case/recompute';
import type { Comparison } from '../core/compare/compare-tests';
import { fail, locatedError, ok, type Result } from '../core/model/errors';
import { buildReport, type SignatureKind } from '../core/report/build-report';
import { signReport } from './sign-report';
import { writeFileAtomic } from './atomic-write';
import { saveCase } from './case-folder';
import { cachedEngine } from './cached-engine';
import { reportFonts } from './fonts';
import { readFileBytes } from './read-bytes';

export interface Certificate {
  readonly p12: Uint8Array;
  readonly passphrase: string;
  readonly name: string;
  readonly kind: Exclude<SignatureKind, 'unsigned'>;
}

/**
 * A certificate still being made: its kind and name are known at once, its key material
 * later (the demonstration key is generated off the main thread while the report is built,
 * and awaited only to sign).
 */
export interface PendingCertificate {
  readonly kind: Certificate['kind'];
  readonly name: string;
  readonly material: Promise<{ readonly p12: Uint8Array; readonly passphrase: string }>;
}

export interface ReportJob {
  readonly caseFile: CaseFile;
  readonly raw: RawBytes;
  readonly caseFolder: string;
  readonly outPath: string;
  readonly reviewer: string | null;
  readonly certificate: Certificate | PendingCertificate | null;
  readonly now: Date;
}

export interface ReportJobResult {
  readonly casePath: string;
  readonly outPath: string;
  readonly bytes: number;
  readonly outcome: CaseOutcome<Comparison>;
  readonly caseFile: CaseFile;
}

const engine = cachedEngine();

/** Recomputes the case and records its numbers (the state every save and report carries). */
export function recordCase(caseFile: CaseFile, raw: RawBytes): Result<{ caseFile: CaseFile; outcome: CaseOutcome<Comparison> }> {
  const outcome = recomputeCase(caseFile, raw, engine);
  if (!outcome.ok) return outcome;
  return ok({ caseFile: { ...caseFile, recorded: outcome.value.recorded }, outcome: outcome.value });
}

export async function runReportJob(job: ReportJob): Promise<Result<ReportJobResult>> {
  const recorded = recordCase(job.caseFile, job.raw);
  if (!recorded.ok) return recorded;
  const { caseFile, outcome } = recorded.value;
  // A refused pair (same file or series for both days, day order, day metadata) gets no report.
  const refusal = outcome.comparison.refusals[0];
  if (refusal) return fail(locatedError(`pair-${refusal.code}`, outcome.comparison.day2Source, null, null, `No report: ${refusal.message}`));
  const generatedAt = job.now.toISOString().replace(/\.\d{3}Z$/, 'Z');
  const pdf = await buildReport({
    caseFile,
    caseText: caseToText(caseFile),
    outcome,
    raw: job.raw,
    fonts: reportFonts(),
    generatedAt,
    reviewer: job.reviewer,
    signature: job.certificate ? job.certificate.kind : 'unsigned',
  });
  let bytes = pdf;
  if (job.certificate) {
    const { p12, passphrase } = 'material' in job.certificate ? await job.certificate.material : job.certificate;
    const signed = await signReport(pdf, {
      p12,
      passphrase,
      p12Name: job.certificate.name,
      signerName: job.reviewer ?? 'Twofold',
      reason: job.certificate.kind === 'demonstration' ? 'Demonstration signature, not clinical' : 'Two-day CPET report reviewed and issued',
      location: outcome.day1.analysis.metadata.extra['lab'] ?? '',
      signingTime: job.now,
    });
    if (!signed.ok) return signed;
    bytes = signed.value;
  }
  // The case is saved only once the report is built and signed, so a failed signature leaves the folder as it was.
  const saved = saveCase(job.caseFolder, caseFile, job.raw);
  if (!saved.ok) return saved;
  writeFileAtomic(job.outPath, bytes);
  return ok({ casePath: saved.value, outPath: job.outPath, bytes: bytes.length, outcome, caseFile });
}

/** A raw file as the case needs it: its bare name and its bytes. */
export function readRaw(path: string): { name: string; bytes: Uint8Array } {
  return { name: basename(path), bytes: readFileBytes(path) };
}
