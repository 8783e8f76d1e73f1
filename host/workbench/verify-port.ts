/**
 * Report verification for the workbench: exactly the checks `twofold verify` makes
 * (host/verify-report.ts: signature over the whole file, embedded files and their SHA-256,
 * case file and reviewer-log chain, numbers recomputed and compared), as the Sign-off
 * screen lists them.
 */
import { verifyReport } from '../verify-report';
import type { VerificationOutcome } from './service';

/** Check n, named by the step's own heading when it has one ("Embedded files: …"). */
function checkName(what: string, index: number): string {
  const colon = what.indexOf(':');
  return colon > 0 && colon <= 30 ? `Check ${index + 1} (${what.slice(0, colon)})` : `Check ${index + 1}`;
}

export async function verifyReportBytes(bytes: Uint8Array, fileName: string): Promise<VerificationOutcome> {
  const outcome = verifyReport(bytes, fileName);
  const failed = outcome.steps.find((s) => !s.ok);
  return {
    valid: outcome.passed,
    summary: outcome.passed ? 'The report is intact and its numbers reproduce.' : `The report did NOT verify: ${failed?.what ?? 'a check failed'}`,
    checks: outcome.steps.map((s, i) => ({ name: checkName(s.what, i), passed: s.ok, detail: s.what })),
  };
}
