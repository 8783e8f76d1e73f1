/**
 * Everything `twofold verify` checks, in order, each step a plain statement:
 * the signature (valid, covering the whole file), the embedded files (present, their SHA-256
 * matching the case file), the case file (schema and reviewer-log chain), the numbers
 * (recomputed from the embedded raw files, each read with the column map the embedded case
 * file records for it, the settings and reviewer log, equal to the recorded ones), the
 * printed comparison figures read back in the locale the case records (printed-numbers.ts),
 * the signer (a certificate chain to the lab's trust list, core/report/trust.ts) and the pages
 * (rebuilt from the embedded case, raw files and build record, and compared page by page,
 * report-pages.ts). With a case folder's log at hand it also checks that the log still
 * continues the head the report recorded (nothing cut off since). The report passes only
 * when every step holds; `untrustedOnly` says the one failure is the signer's trust.
 */
import { columnMapOf } from '../core/case/case-file';
import { caseFromText } from '../core/case/case-text';
import { differingPaths } from '../core/case/flatten';
import { recomputeCase } from '../core/case/recompute';
import { sha256Hex } from '../core/case/sha256';
import type { Comparison } from '../core/compare/compare-tests';
import { SOFTWARE_VERSION } from '../core/version';
import { verifySignature } from '../core/report/verify-signature';
import { BUILD_RECORD_NAME, logShortenedFrom, parseBuildRecord } from '../core/report/build-record';
import { buildReport } from '../core/report/build-report';
import { checkTrust, type TrustAnchor } from '../core/report/trust';
import type { CaseFile } from '../core/case/case-file';
import { cachedEngine } from './cached-engine';
import { reportFonts } from './fonts';
import { embeddedFiles } from './pdf-attachments';
import { pdfText } from './pdf-text';
import { checkPrintedNumbers } from './printed-numbers';
import { comparePages } from './report-pages';

export interface VerifyStep {
  readonly ok: boolean;
  readonly what: string;
}

export interface VerifyOutcome {
  readonly passed: boolean;
  /** True when every check but the signer's trust holds. */
  readonly untrustedOnly: boolean;
  readonly steps: readonly VerifyStep[];
}

export interface VerifyOptions {
  /** Certificates the lab trusts; nothing is trusted without them. */
  readonly trust: readonly TrustAnchor[];
  /** The reviewer log of the case folder the report was made from, when it is at hand. */
  readonly caseLog?: { readonly log: CaseFile['log']; readonly path: string };
  /** Time for certificate validity when the signature states none. */
  readonly now?: Date;
}

export async function verifyReport(pdf: Uint8Array, file: string, options: VerifyOptions): Promise<VerifyOutcome> {
  const steps: VerifyStep[] = [];
  let trustFailed = false;
  const finish = (): VerifyOutcome => {
    const passed = steps.every((s) => s.ok);
    return { passed, untrustedOnly: !passed && trustFailed && steps.filter((s) => !s.ok).length === 1, steps };
  };
  const done = (ok: boolean, what: string): VerifyOutcome => {
    steps.push({ ok, what });
    return finish();
  };

  const signature = verifySignature(pdf, file);
  if (!signature.ok) return done(false, `Signature: ${signature.error.message}`);
  const s = signature.value;
  steps.push({ ok: true, what: `Signature valid (${s.digestAlgorithm}), covering the whole file (bytes 0–${s.byteRange[1]} and ${s.byteRange[2]}–${s.byteRange[2] + s.byteRange[3]} of ${pdf.length}); signer "${s.signer}"${s.selfSigned ? ', a self-signed certificate' : ''}${s.signingTime ? `, signed ${s.signingTime}` : ''}.` });
  const trusted = checkTrust(s.certificatePem, s.otherCertificatesPem, options.trust, [...(s.signingTime ? [new Date(s.signingTime)] : []), options.now ?? new Date()], file);
  if (trusted.ok) steps.push({ ok: true, what: `Signer trusted: ${trusted.value.path.map((n) => `"${n}"`).join(' issued by ')} chains to a certificate on the trust list (${trusted.value.anchor}).` });
  else {
    trustFailed = true;
    steps.push({ ok: false, what: `Signer: ${trusted.error.message}` });
  }

  const files = embeddedFiles(pdf, file);
  if (!files.ok) return done(false, `Embedded files: ${files.error.message}`);
  const caseEntry = files.value.find((f) => f.name === 'twofold-case.json');
  if (!caseEntry) return done(false, 'Embedded files: the case file (twofold-case.json) is not attached.');
  const parsed = caseFromText(new TextDecoder().decode(caseEntry.bytes), 'twofold-case.json (embedded)');
  if (!parsed.ok) return done(false, `Case file: ${parsed.error.message}`);
  const caseFile = parsed.value;
  steps.push({ ok: true, what: `Case file valid; reviewer log of ${caseFile.log.length} entries intact (hash chain checked).` });

  const raw: Uint8Array[] = [];
  for (const [day, input] of [[1, caseFile.inputs.day1], [2, caseFile.inputs.day2]] as const) {
    const entry = files.value.find((f) => f.name === `day${day}-${input.name}`);
    if (!entry) return done(false, `Embedded files: the day ${day} raw file ${input.name} is not attached.`);
    const hash = sha256Hex(entry.bytes);
    if (hash !== input.sha256) return done(false, `Embedded files: the day ${day} raw file ${input.name} has SHA-256 ${hash}, but the case records ${input.sha256}.`);
    raw.push(entry.bytes);
  }
  const mapped = ([1, 2] as const).filter((day) => columnMapOf(day === 1 ? caseFile.inputs.day1 : caseFile.inputs.day2) !== null);
  const maps = mapped.length === 0 ? '' : ` ${mapped.map((d) => `Day ${d}`).join(' and ')} read with the column map${mapped.length > 1 ? 's' : ''} the case records.`;
  steps.push({ ok: true, what: `Both raw files attached, SHA-256 as recorded (${caseFile.inputs.day1.sha256.slice(0, 12)}…, ${caseFile.inputs.day2.sha256.slice(0, 12)}…).${maps}` });

  if (!caseFile.recorded) return done(false, 'Numbers: the case file records no results to compare with.');
  let outcome: ReturnType<typeof recomputeCase<Comparison>>;
  try {
    outcome = recomputeCase(caseFile, { day1: raw[0], day2: raw[1] }, cachedEngine());
  } catch (error) {
    return done(false, `Numbers: the analysis stopped with an internal error while re-running (${error instanceof Error ? error.message : String(error)}).`);
  }
  if (!outcome.ok) return done(false, `Numbers: the analysis could not be re-run: ${outcome.error.message}`);
  const differing = differingPaths(caseFile.recorded.numbers, outcome.value.recorded.numbers);
  if (differing.length > 0 || outcome.value.recorded.digest !== caseFile.recorded.digest) {
    const named = differing.slice(0, 5).map((p) => `${p} recorded ${String(caseFile.recorded?.numbers[p])}, recomputed ${String(outcome.value.recorded.numbers[p])}`);
    const version = caseFile.recorded.softwareVersion !== SOFTWARE_VERSION ? ` The report was made by version ${caseFile.recorded.softwareVersion}; this is ${SOFTWARE_VERSION}.` : '';
    return done(false, `Numbers: recomputing does not give the recorded results (${differing.length} of ${Object.keys(caseFile.recorded.numbers).length} numbers differ${named.length ? `: ${named.join('; ')}` : '; the full-result digest differs'}).${version}`);
  }
  steps.push({ ok: true, what: `Numbers: all ${Object.keys(caseFile.recorded.numbers).length} recorded numbers and the full-result digest reproduced from the embedded files, settings and reviewer log.` });

  // The printed comparison figures, read back in the locale the case records.
  const locale = caseFile.reportLocale ?? 'en';
  const text = pdfText(pdf);
  if (text === null) steps.push({ ok: true, what: `Printed figures: not read back (pdftotext from poppler-utils is not installed); the report states its numbers in ${locale}.` });
  else {
    const printed = checkPrintedNumbers(text, outcome.value.comparison, caseFile.reportLocale);
    if (!printed.ok) return done(false, `Printed figures: read in ${locale}, ${printed.problems.length} of ${printed.checked} comparison figures do not match (${printed.problems.slice(0, 3).join('; ')}).`);
    steps.push({ ok: true, what: `Printed figures: all ${printed.checked} day 1 and day 2 figures of the comparison table read back in ${locale} equal the recomputed values.` });
  }
  const recordEntry = files.value.find((f) => f.name === BUILD_RECORD_NAME);
  if (!recordEntry) return done(false, `Pages: the report carries no build record (${BUILD_RECORD_NAME}), so its pages cannot be rebuilt and compared; it was made by a Twofold older than this check.`);
  const record = parseBuildRecord(new TextDecoder().decode(recordEntry.bytes), `${BUILD_RECORD_NAME} (embedded)`);
  if (!record.ok) return done(false, `Pages: ${record.error.message}`);
  const head = record.value.logHead;
  const headProblem = logShortenedFrom(caseFile, head) ?? (caseFile.log.length !== head.entries ? `the build record names a reviewer log of ${head.entries} entries, the embedded case holds ${caseFile.log.length}` : null);
  if (headProblem) return done(false, `Reviewer log: ${headProblem}`);
  let rebuilt: Uint8Array;
  try {
    rebuilt = await buildReport({ caseFile, caseText: new TextDecoder().decode(caseEntry.bytes), outcome: outcome.value, raw: { day1: raw[0], day2: raw[1] }, fonts: reportFonts(), generatedAt: record.value.generatedAt, reviewer: record.value.reviewer, signature: record.value.signature });
  } catch (error) {
    return done(false, `Pages: the report could not be rebuilt from its embedded case (${error instanceof Error ? error.message : String(error)}).`);
  }
  const pages = comparePages(pdf, rebuilt);
  if (!pages.same) {
    const version = record.value.softwareVersion !== SOFTWARE_VERSION ? ` The report was made by version ${record.value.softwareVersion}; this is ${SOFTWARE_VERSION}.` : '';
    return done(false, `Pages: ${pages.what}${version}`);
  }
  steps.push({ ok: true, what: `Pages: all ${pages.pages} pages are exactly the pages rebuilt from the embedded case, raw files and build record.` });
  if (options.caseLog) {
    const cut = logShortenedFrom({ log: options.caseLog.log }, head);
    if (cut) return done(false, `Case folder ${options.caseLog.path}: ${cut}`);
    steps.push({ ok: true, what: `Case folder ${options.caseLog.path}: its reviewer log (${options.caseLog.log.length} entries) continues the ${head.entries} entries this report records.` });
  }
  return finish();
}
