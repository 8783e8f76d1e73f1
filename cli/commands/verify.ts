/**
 * `twofold verify REPORT.pdf --trust FILE…`: checks the signature and that it covers the
 * whole file, that the signer's certificate chains to a certificate the lab trusts, extracts
 * the embedded raw files and case file, checks their SHA-256, re-runs the analysis with the
 * embedded settings and reviewer log, confirms the numbers, rebuilds the pages and compares
 * them page by page; with --case, also that the case folder's log still continues the
 * report's. One line per check. Exit 0 only when every check holds; 3 when everything holds
 * but the signer is not trusted; 1 when any other check fails; 2 when a file cannot be read.
 */
import { resolve } from 'node:path';
import { formatLocated } from '../../core/model/errors';
import { loadCase } from '../../host/case-folder';
import { readProblem } from '../../host/read-problem';
import { readFileBytes } from '../../host/read-bytes';
import { readTrustFiles } from '../../host/trust-files';
import { verifyReport, type VerifyOptions } from '../../host/verify-report';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, UsageError, type CliIo } from '../io';

/** Every check held except that the signer's certificate is not on (or does not chain to) the trust list. */
export const EXIT_UNTRUSTED = 3;

const USAGE = `usage: twofold verify REPORT.pdf --trust CERT.pem [--trust CERT.pem ...] [--case FOLDER] [--json]

  --trust FILE   a PEM file of certificates your lab trusts (its CA, or its own certificate);
                 repeat for more. Nothing is trusted without one, the demonstration
                 certificate included (twofold demo writes it as demo-certificate.pem).
  --case FOLDER  the case folder the report was made from: also check that its reviewer
                 log still holds every entry the report records
  --json         print the checks as JSON

exit 0: every check holds; 3: all hold but the signer is not trusted; 1: a check fails;
2: a file cannot be read
`;

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, { json: { type: 'boolean' }, trust: { type: 'string', multiple: true }, case: { type: 'string' }, help: { type: 'boolean', short: 'h' } });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one REPORT.pdf\n\n${USAGE}`);
  const path = resolve(io.cwd, positionals[0]);
  let bytes: Uint8Array;
  try {
    bytes = readFileBytes(path);
  } catch (error) {
    io.err(`${path}:0:0: ${readProblem(error, 'report')}\n`);
    return EXIT_BAD_INPUT;
  }
  const trust = readTrustFiles((values.trust ?? []).map((t) => resolve(io.cwd, t)));
  if (!trust.ok) {
    io.err(`${formatLocated(trust.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const options: { -readonly [K in keyof VerifyOptions]: VerifyOptions[K] } = { trust: trust.value };
  if (values.case) {
    const loaded = loadCase(resolve(io.cwd, values.case));
    if (!loaded.ok) {
      io.err(`${formatLocated(loaded.error)}\n`);
      return EXIT_BAD_INPUT;
    }
    options.caseLog = { log: loaded.value.caseFile.log, path: loaded.value.path };
  }
  const outcome = await verifyReport(bytes, path, options);
  if (values.json) io.out(`${JSON.stringify(outcome, null, 2)}\n`);
  else {
    for (const step of outcome.steps) io.out(`${step.ok ? 'ok    ' : 'FAILED'} ${step.what}\n`);
    io.out(outcome.passed ? 'The report is intact, signed by a trusted certificate, and its numbers and pages reproduce.\n' : outcome.untrustedOnly ? 'The report is intact, but its signer is NOT trusted: who signed it is not established.\n' : 'The report did NOT verify.\n');
  }
  return outcome.passed ? EXIT_OK : outcome.untrustedOnly ? EXIT_UNTRUSTED : EXIT_OTHER;
}
