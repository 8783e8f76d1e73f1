/**
 * `twofold demo [--out DIR]`: the whole job on the demo declining pair: analyse, compare,
 * record one reviewer override with its reason, build the report and sign it with a
 * demonstration certificate generated on the spot (marked as not a clinical signature).
 */
import { resolve } from 'node:path';
import { formatLocated } from '../../core/model/errors';
import { runDemo } from '../../host/demo-job';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_OTHER, type CliIo } from '../io';
import { outputFolderProblem } from '../../host/output-check';

const USAGE = `usage: twofold demo [--out DIR] [--paper a4|letter]

  --out DIR          where the report, the case folder and the demo certificate go (default demo-out)
  --paper a4|letter  page size (default a4)
`;

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values } = parseFlags(args, { out: { type: 'string' }, paper: { type: 'string' }, help: { type: 'boolean', short: 'h' } }, false);
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  const paper = values.paper === 'letter' ? 'letter' : 'a4';
  const dir = resolve(io.cwd, values.out ?? 'demo-out');
  const outProblem = outputFolderProblem(dir);
  if (outProblem) {
    io.err(`${dir}:0:0: ${outProblem}\n`);
    return EXIT_BAD_INPUT;
  }
  const started = Date.now();
  const result = await runDemo(dir, new Date(), paper);
  if (!result.ok) {
    io.err(`${formatLocated(result.error)}\n`);
    return EXIT_OTHER;
  }
  const r = result.value;
  io.out(
    [
      'Twofold demonstration (invented data, demonstration certificate: not a clinical signature)',
      `report       ${r.outPath} (${r.bytes} bytes, signed)`,
      `case         ${r.casePath}`,
      `certificate  ${r.certificatePath}`,
      `summary      ${r.outcome.comparison.summary.split('. ').slice(0, 2).join('. ')}.`,
      `took         ${Date.now() - started} ms`,
      '',
      `check it:    twofold verify ${r.outPath} --trust ${r.certificatePath}`,
      '',
    ].join('\n'),
  );
  return EXIT_OK;
}
