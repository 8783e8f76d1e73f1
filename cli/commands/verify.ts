/**
 * `twofold verify REPORT.pdf`: checks the signature and that it covers the whole file,
 * extracts the embedded raw files and case file, checks their SHA-256, re-runs the analysis
 * with the embedded settings and reviewer log, and confirms the numbers. Prints one line per
 * check. Exit 0 only when every check holds, 1 when one fails, 2 when the file cannot be read.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { verifyReport } from '../../host/verify-report';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold verify REPORT.pdf [--json]

  --json   print the checks as JSON
`;

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, { json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one REPORT.pdf\n\n${USAGE}`);
  const path = resolve(io.cwd, positionals[0]);
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(readFileSync(path));
  } catch {
    io.err(`${path}:0:0: The report cannot be read (missing, or no permission).\n`);
    return EXIT_BAD_INPUT;
  }
  const outcome = verifyReport(bytes, path);
  if (values.json) io.out(`${JSON.stringify(outcome, null, 2)}\n`);
  else {
    for (const step of outcome.steps) io.out(`${step.ok ? 'ok    ' : 'FAILED'} ${step.what}\n`);
    io.out(outcome.passed ? 'The report is intact and its numbers reproduce.\n' : 'The report did NOT verify.\n');
  }
  return outcome.passed ? EXIT_OK : EXIT_OTHER;
}
