/**
 * `twofold report`: build the PDF report of a pair, and sign it with the lab's certificate.
 *
 *   twofold report DAY1 DAY2 --out REPORT.pdf [--case FOLDER] [--sign FILE.p12 --pass-env VAR]
 *                  [--reviewer "Name, credential"] [--paper a4|letter]
 *
 * The case folder (default: REPORT-case/ beside the report) holds twofold-case.json and the
 * raw copies; an existing case is reopened (its reviewer log kept) and must be of the same two
 * files. The certificate password comes from the environment variable named by --pass-env,
 * or from a prompt on an interactive terminal; never from the command line.
 * Exit 0 when the report was written, 2 for bad input, 1 otherwise.
 */
import { existsSync, readFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import { newCase } from '../../core/case/new-case';
import { sha256Hex } from '../../core/case/sha256';
import { formatLocated } from '../../core/model/errors';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { CASE_FILE_NAME, caseFilePath, loadCase } from '../../host/case-folder';
import { readPassword } from '../../host/password';
import { readRaw, runReportJob } from '../../host/report-job';
import { parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold report DAY1 DAY2 --out REPORT.pdf [--case FOLDER] [--sign FILE.p12 --pass-env VAR]
                      [--reviewer "Name, credential"] [--paper a4|letter]

  --out FILE        where the PDF is written (replaced atomically)
  --case FOLDER     the case folder (or its twofold-case.json) to reopen or create
                    (default: REPORT-case/ beside the report)
  --sign FILE.p12   sign with this PKCS#12 certificate (the lab's)
  --pass-env VAR    read the certificate password from environment variable VAR
                    (without it, Twofold asks on the terminal)
  --reviewer TEXT   "Name, credential" printed in the signature block
  --paper a4|letter page size for a new case (default a4)
`;

/** --case names the folder, or the twofold-case.json inside it; by default REPORT-case/ beside the report. */
function caseFolder(flag: string | undefined, out: string, cwd: string): string {
  if (flag === undefined) return join(dirname(out), `${basename(out).replace(/\.pdf$/i, '')}-case`);
  const path = resolve(cwd, flag);
  if (!/\.json$/i.test(path)) return path;
  if (basename(path) !== CASE_FILE_NAME) throw new UsageError(`--case: a case file is always named ${CASE_FILE_NAME} inside its case folder; give the folder`);
  return dirname(path);
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, {
    out: { type: 'string' },
    case: { type: 'string' },
    sign: { type: 'string' },
    'pass-env': { type: 'string' },
    reviewer: { type: 'string' },
    paper: { type: 'string' },
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 2 || !values.out) throw new UsageError(`expected DAY1 DAY2 and --out\n\n${USAGE}`);
  if (values.paper !== undefined && values.paper !== 'a4' && values.paper !== 'letter') throw new UsageError(`--paper expects a4 or letter, got '${values.paper}'`);
  if (values['pass-env'] && !values.sign) throw new UsageError('--pass-env needs --sign FILE.p12');
  const out = resolve(io.cwd, values.out);
  const folder = caseFolder(values.case, out, io.cwd);
  const paths = positionals.map((p) => resolve(io.cwd, p));
  for (const p of paths) {
    if (!existsSync(p)) {
      io.err(`${p}:0:0: This breath file does not exist.\n`);
      return EXIT_BAD_INPUT;
    }
  }
  const day1 = readRaw(paths[0]);
  const day2 = readRaw(paths[1]);
  const paper = (values.paper as 'a4' | 'letter' | undefined) ?? 'a4';
  const now = new Date();

  let caseFile;
  if (existsSync(caseFilePath(folder))) {
    const loaded = loadCase(folder);
    if (!loaded.ok) {
      io.err(`${formatLocated(loaded.error)}\n`);
      return EXIT_BAD_INPUT;
    }
    caseFile = loaded.value.caseFile;
    for (const [day, file, input] of [[1, day1, caseFile.inputs.day1], [2, day2, caseFile.inputs.day2]] as const) {
      if (sha256Hex(file.bytes) !== input.sha256) {
        io.err(`${paths[day - 1]}:0:0: The case in ${folder} was built from a different day ${day} file (${input.name}); give the same files, or another --case folder.\n`);
        return EXIT_BAD_INPUT;
      }
    }
    if (values.paper !== undefined && values.paper !== caseFile.settings.report.paper) {
      io.err(`${caseFilePath(folder)}:0:0: This case is set to ${caseFile.settings.report.paper} paper; settings of a case with a reviewer log are fixed, so --paper cannot change it.\n`);
      return EXIT_BAD_INPUT;
    }
  } else {
    const at = now.toISOString().replace(/\.\d{3}Z$/, 'Z');
    caseFile = newCase(at, day1, day2, { ...DEFAULT_SETTINGS, report: { paper } }, { day1: noClinicalInputs(), day2: noClinicalInputs() });
  }

  let certificate = null;
  if (values.sign) {
    const p12Path = resolve(io.cwd, values.sign);
    if (!existsSync(p12Path)) {
      io.err(`${p12Path}:0:0: The certificate file does not exist.\n`);
      return EXIT_BAD_INPUT;
    }
    const passphrase = values['pass-env'] ? io.env[values['pass-env']] : io.interactive ? await readPassword(`Password for ${basename(p12Path)}: `) : undefined;
    if (passphrase === undefined) {
      io.err(values['pass-env'] ? `twofold report: the environment variable ${values['pass-env']} is not set.\n` : 'twofold report: no terminal to ask for the certificate password; use --pass-env VAR.\n');
      return EXIT_BAD_INPUT;
    }
    certificate = { p12: new Uint8Array(readFileSync(p12Path)), passphrase, name: p12Path, kind: 'lab' as const };
  }

  const result = await runReportJob({ caseFile, raw: { day1: day1.bytes, day2: day2.bytes }, caseFolder: folder, outPath: out, reviewer: values.reviewer ?? null, certificate, now });
  if (!result.ok) {
    io.err(`${formatLocated(result.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  io.out(`report  ${result.value.outPath} (${result.value.bytes} bytes, ${certificate ? 'signed' : 'unsigned'})\ncase    ${result.value.casePath}\n`);
  return EXIT_OK;
}
