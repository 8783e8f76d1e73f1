/**
 * Report verification for the workbench: exactly the checks `twofold verify` makes
 * (host/verify-report.ts: signature over the whole file, the signer's chain to a trusted
 * certificate, embedded files and their SHA-256, case file and reviewer-log chain, numbers
 * recomputed and compared, pages rebuilt and compared), run off the request thread with a
 * time limit (off-thread.ts), as the Sign-off screen lists them.
 */
import type { TrustAnchor } from '../../core/report/trust';
import type { VerificationOutcome } from './service';
import { runOffThread } from './off-thread';

/** Check n, named by the step's own heading when it has one ("Embedded files: …"). */
function checkName(what: string, index: number): string {
  const colon = what.indexOf(':');
  return colon > 0 && colon <= 30 ? `Check ${index + 1} (${what.slice(0, colon)})` : `Check ${index + 1}`;
}

export async function verifyReportBytes(bytes: Uint8Array, fileName: string, trust: readonly TrustAnchor[], limitMs?: number): Promise<VerificationOutcome> {
  const run = await runOffThread('verify', { bytes, fileName, trust }, limitMs);
  const outcome = run.done ? run.value : { passed: false, untrustedOnly: false, steps: [{ ok: false, what: `Verification ${run.why}; the report was not verified.` }] };
  const failed = outcome.steps.find((s) => !s.ok);
  return {
    valid: outcome.passed,
    summary: outcome.passed
      ? 'The report is intact, signed by a trusted certificate, and its numbers and pages reproduce.'
      : outcome.untrustedOnly
        ? `The report is intact, but its signer is NOT trusted: ${failed?.what ?? ''}`
        : `The report did NOT verify: ${failed?.what ?? 'a check failed'}`,
    checks: outcome.steps.map((s, i) => ({ name: checkName(s.what, i), passed: s.ok, detail: s.what })),
  };
}
