/**
 * `twofold report`: build the PDF report of a pair, and sign it with the lab's certificate.
 *
 *   twofold report DAY1 DAY2 --out REPORT.pdf [--case FOLDER] [--sign FILE.p12 [--pass-stdin | --pass-env VAR]]
 *                  [--reviewer "Name, credential"] [--paper a4|letter] [--locale TAG]
 *                  [--dayN-rest-hr BPM --dayN-lactate MMOL --dayN-rpe N
 *                   --dayN-fev1-l L | --dayN-mvv-l-min L_MIN] [--amend-clinical]
 *
 * The case folder (default: REPORT-case/ beside the report) holds twofold-case.json and the
 * raw copies; an existing case is reopened (its reviewer log kept) and must be of the same two
 * files. The certificate password comes from a prompt on an interactive terminal (no echo),
 * the first line of standard input (--pass-stdin) or the environment variable named by
 * --pass-env; never from the command line, and it is never written anywhere (docs/report.md
 * weighs the three).
 *
 * Clinical inputs (what the lab recorded beside each breath file) go into the case's
 * `clinical.day1` / `clinical.day2`. A reopened case keeps the inputs it recorded; a flag
 * that repeats a recorded value is accepted. A flag that differs from a recorded value is
 * refused with the differences listed, because a changed input changes the numbers: it is
 * applied only with --amend-clinical, and only while the reviewer log is empty, since the
 * log's first entry is chained to the clinical inputs (core/case/audit-log.ts) and changing
 * them would break the chain. Every amendment is printed, value by value.
 * The report writes its numbers and dates in a locale (core/locale/): --locale, else the one
 * a reopened case records, else the environment's (LC_ALL, LC_NUMERIC, LANG); the case
 * records it, so `twofold verify` reads the printed numbers back in it.
 * Exit 0 when the report was written, 2 for bad input, 1 otherwise.
 */
import { existsSync, readFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { noClinicalInputs } from '../../core/analyze/analyze-test';
import type { CaseFile, DayNumber } from '../../core/case/case-file';
import { newCase } from '../../core/case/new-case';
import { sha256Hex } from '../../core/case/sha256';
import type { ClinicalInputs } from '../../core/model/analysis';
import { formatLocated } from '../../core/model/errors';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { resealOpening, reviewerEntries } from '../../core/case/opening';
import { outputFileProblem } from '../../host/output-check';
import { readProblem } from '../../host/read-problem';
import { CASE_FILE_NAME, caseFilePath, loadCase } from '../../host/case-folder';
import { MAX_PASSWORD_CHARS, readPassword } from '../../host/password';
import { readRaw, runReportJob } from '../../host/report-job';
import { numberFlag, parseFlags } from '../args';
import { differingMaps, readMapFlags } from '../column-maps';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CliIo } from '../io';
import { localeFromEnvironment, REPORT_LOCALES, resolveLocale } from '../../core/locale/locales';

const USAGE = `usage: twofold report DAY1 DAY2 --out REPORT.pdf [--case FOLDER] [--sign FILE.p12 [--pass-stdin | --pass-env VAR]]
                      [--reviewer "Name, credential"] [--paper a4|letter] [--locale TAG]
                      [--day1-rest-hr BPM] [--day1-lactate MMOL] [--day1-rpe N]
                      [--day1-fev1-l L | --day1-mvv-l-min L_MIN]   (and the same for --day2-…)
                      [--amend-clinical] [--day1-map MAP.json] [--day2-map MAP.json]

  --out FILE        where the PDF is written (replaced atomically)
  --case FOLDER     the case folder (or its twofold-case.json) to reopen or create
                    (default: REPORT-case/ beside the report)
  --sign FILE.p12   sign with this PKCS#12 certificate (the lab's)
  --pass-stdin      read the certificate password from the first line of standard input
  --pass-env VAR    read the certificate password from environment variable VAR
                    (without either, Twofold asks on the terminal, without echo)
  --reviewer TEXT   "Name, credential" printed in the signature block
  --paper a4|letter page size for a new case (default a4)
  --locale TAG      decimal mark, thousands separator and date order of the report's
                    numbers and dates, e.g. de-DE, fr-FR, sv-SE, en-GB, or en (neutral:
                    decimal point, ISO dates). Default: the case's, else LC_ALL/LC_NUMERIC/LANG

  What the lab recorded beside each breath file (N is 1 or 2):
  --dayN-rest-hr BPM      resting heart rate, bpm (20–200)
  --dayN-lactate MMOL     peak blood lactate, mmol/L (0–40)
  --dayN-rpe N            peak Borg rating, 6–20
  --dayN-fev1-l L         FEV1, L (0.2–9; MVV is estimated as FEV1 × 40)
  --dayN-mvv-l-min L_MIN  measured MVV, L/min (5–400); give FEV1 or MVV, not both
  --amend-clinical        change inputs an existing case recorded (only while its reviewer
                          log is empty); without it a differing value is refused

  --dayN-map MAP.json     the column map (twofold-column-map, docs/formats.md) to read day N's
                          file with, for a new case; a reopened case keeps its recorded maps
`;

/** One clinical input as a flag: its case field, range and words. Ranges match the workbench's intake. */
interface ClinicalFlag {
  readonly key: keyof ClinicalInputs;
  readonly flag: string;
  readonly label: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
}

const CLINICAL_FLAGS: readonly ClinicalFlag[] = [
  { key: 'restingHrBpm', flag: 'rest-hr', label: 'resting HR', unit: 'bpm', min: 20, max: 200 },
  { key: 'lactateMmolL', flag: 'lactate', label: 'peak lactate', unit: 'mmol/L', min: 0, max: 40 },
  { key: 'peakRpe', flag: 'rpe', label: 'peak Borg RPE', unit: '', min: 6, max: 20 },
  { key: 'fev1L', flag: 'fev1-l', label: 'FEV1', unit: 'L', min: 0.2, max: 9 },
  { key: 'mvvLMin', flag: 'mvv-l-min', label: 'measured MVV', unit: 'L/min', min: 5, max: 400 },
];

const DAYS = [1, 2] as const;

function clinicalOptions() {
  const options: Record<string, { type: 'string' }> = {};
  for (const day of DAYS) for (const f of CLINICAL_FLAGS) options[`day${day}-${f.flag}`] = { type: 'string' };
  return options;
}

type GivenClinical = Partial<Record<keyof ClinicalInputs, number | null>>;

/**
 * The clinical inputs given on the command line for one day. FEV1 and a measured MVV are two
 * sources of the same quantity, so giving one also clears the other.
 */
function givenClinical(values: Record<string, string | boolean | undefined>, day: DayNumber): GivenClinical {
  const given: GivenClinical = {};
  for (const f of CLINICAL_FLAGS) {
    const name = `day${day}-${f.flag}`;
    const raw = values[name];
    const value = numberFlag(name, typeof raw === 'string' ? raw : undefined);
    if (value === undefined) continue;
    if (value < f.min || value > f.max) throw new UsageError(`--${name} expects ${f.label} from ${f.min} to ${f.max}${f.unit ? ` ${f.unit}` : ''}, got ${value}`);
    given[f.key] = value;
  }
  if (given.fev1L !== undefined && given.mvvLMin !== undefined) throw new UsageError(`give either --day${day}-fev1-l or --day${day}-mvv-l-min, not both`);
  if (given.fev1L !== undefined) given.mvvLMin = null;
  else if (given.mvvLMin !== undefined) given.fev1L = null;
  return given;
}

function clinicalValue(f: ClinicalFlag, value: number | null): string {
  return value === null ? 'not given' : `${value}${f.unit ? ` ${f.unit}` : ''}`;
}

interface ClinicalChange {
  readonly day: DayNumber;
  readonly field: ClinicalFlag;
  readonly recorded: number | null;
  readonly given: number | null;
}

function clinicalChanges(recorded: CaseFile['clinical'], given: Record<DayNumber, GivenClinical>): ClinicalChange[] {
  const changes: ClinicalChange[] = [];
  for (const day of DAYS) {
    const before = day === 1 ? recorded.day1 : recorded.day2;
    for (const field of CLINICAL_FLAGS) {
      const value = given[day][field.key];
      if (value !== undefined && value !== before[field.key]) changes.push({ day, field, recorded: before[field.key], given: value });
    }
  }
  return changes;
}

function describeChange(c: ClinicalChange): string {
  return `day ${c.day} ${c.field.label}: ${clinicalValue(c.field, c.recorded)} → ${clinicalValue(c.field, c.given)}`;
}

function clinicalLine(day: DayNumber, inputs: ClinicalInputs): string {
  return `day ${day}   ${CLINICAL_FLAGS.map((f) => `${f.label} ${clinicalValue(f, inputs[f.key])}`).join(', ')}`;
}

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
    'pass-stdin': { type: 'boolean' },
    reviewer: { type: 'string' },
    paper: { type: 'string' },
    'amend-clinical': { type: 'boolean' },
    'day1-map': { type: 'string' },
    'day2-map': { type: 'string' },
    locale: { type: 'string' },
    ...clinicalOptions(),
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 2 || !values.out) throw new UsageError(`expected DAY1 DAY2 and --out\n\n${USAGE}`);
  if (values.paper !== undefined && values.paper !== 'a4' && values.paper !== 'letter') throw new UsageError(`--paper expects a4 or letter, got '${values.paper}'`);
  if (values['pass-env'] && !values.sign) throw new UsageError('--pass-env needs --sign FILE.p12');
  if (values['pass-stdin'] && !values.sign) throw new UsageError('--pass-stdin needs --sign FILE.p12');
  if (values['pass-stdin'] && values['pass-env']) throw new UsageError('give either --pass-stdin or --pass-env, not both');
  const givenLocale = values.locale === undefined ? null : resolveLocale(values.locale);
  if (values.locale !== undefined && givenLocale === null) throw new UsageError(`--locale: Twofold has no number and date format for '${values.locale}' (known: ${REPORT_LOCALES.map((l) => l.tag).join(', ')})`);
  const given: Record<DayNumber, GivenClinical> = { 1: givenClinical(values, 1), 2: givenClinical(values, 2) };
  if (values['amend-clinical'] && Object.keys(given[1]).length + Object.keys(given[2]).length === 0) {
    throw new UsageError('--amend-clinical needs at least one --day1-… or --day2-… clinical input to change');
  }
  const maps = readMapFlags(values, io.cwd);
  if (!maps.ok) {
    io.err(`${maps.message}\n`);
    return EXIT_BAD_INPUT;
  }
  const out = resolve(io.cwd, values.out);
  // Checked before anything is written, so a report that cannot be written leaves no case folder behind.
  const outProblem = outputFileProblem(out);
  if (outProblem) {
    io.err(`${out}:0:0: ${outProblem}\n`);
    return EXIT_BAD_INPUT;
  }
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

  let caseFile: CaseFile;
  let amended: ClinicalChange[] = [];
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
    const mapDays = differingMaps(caseFile, maps.maps);
    if (mapDays.length > 0) {
      io.err(
        `${caseFilePath(folder)}:0:0: The column map given for day ${mapDays.join(' and ')} differs from the one this case recorded; a case keeps the reading its numbers and review were made on. ` +
          'Nothing was written. To read the files another way, start another case folder (--case NEW_FOLDER).\n',
      );
      return EXIT_BAD_INPUT;
    }
    const changes = clinicalChanges(caseFile.clinical, given);
    if (changes.length > 0) {
      const listed = changes.map((c) => `  ${describeChange(c)}`).join('\n');
      const reviewed = reviewerEntries(caseFile.log).length;
      if (reviewed > 0) {
        io.err(
          `${caseFilePath(folder)}:0:0: These clinical inputs differ from the ones this case recorded, and its reviewer log (${reviewed} ${reviewed === 1 ? 'entry' : 'entries'}) is chained to the recorded inputs, so they cannot be changed here. ` +
            `Nothing was written. To use the new values, start another case folder (--case NEW_FOLDER) and record the review there.\n${listed}\n`,
        );
        return EXIT_BAD_INPUT;
      }
      if (!values['amend-clinical']) {
        io.err(`${caseFilePath(folder)}:0:0: These clinical inputs differ from the ones this case recorded; nothing was written. Add --amend-clinical to change them.\n${listed}\n`);
        return EXIT_BAD_INPUT;
      }
      // The opening entry chains the clinical inputs, so it is made again for the new ones.
      caseFile = resealOpening({ ...caseFile, clinical: { day1: { ...caseFile.clinical.day1, ...given[1] }, day2: { ...caseFile.clinical.day2, ...given[2] } } });
      amended = changes;
    }
  } else {
    const at = now.toISOString().replace(/\.\d{3}Z$/, 'Z');
    caseFile = newCase(at, { ...day1, columnMap: maps.maps[1] }, { ...day2, columnMap: maps.maps[2] }, { ...DEFAULT_SETTINGS, report: { paper } }, { day1: { ...noClinicalInputs(), ...given[1] }, day2: { ...noClinicalInputs(), ...given[2] } });
  }

  caseFile = { ...caseFile, reportLocale: givenLocale?.tag ?? caseFile.reportLocale ?? localeFromEnvironment(io.env) };

  let certificate = null;
  if (values.sign) {
    const p12Path = resolve(io.cwd, values.sign);
    // Read before the password is asked for: a folder or an unreadable file is exit 2, at once.
    let p12: Uint8Array;
    try {
      p12 = new Uint8Array(readFileSync(p12Path));
    } catch (error) {
      io.err(`${p12Path}:0:0: ${readProblem(error, 'certificate file')}\n`);
      return EXIT_BAD_INPUT;
    }
    const envName = values['pass-env'];
    const passphrase = envName
      ? io.env[envName]
      : values['pass-stdin']
        ? await io.stdinLine?.()
        : io.interactive
          ? await readPassword(`Password for ${basename(p12Path)}: `)
          : undefined;
    if (passphrase === undefined || passphrase === '') {
      io.err(
        envName
          ? `twofold report: the environment variable ${envName} is not set or empty.\n`
          : values['pass-stdin']
            ? `twofold report: --pass-stdin: standard input held no password line (empty, or longer than ${MAX_PASSWORD_CHARS} characters).\n`
            : 'twofold report: no terminal to ask for the certificate password; use --pass-stdin or --pass-env VAR.\n',
      );
      return EXIT_BAD_INPUT;
    }
    certificate = { p12, passphrase, name: p12Path, kind: 'lab' as const };
  }

  const result = await runReportJob({ caseFile, raw: { day1: day1.bytes, day2: day2.bytes }, caseFolder: folder, outPath: out, reviewer: values.reviewer ?? null, certificate, now });
  if (!result.ok) {
    io.err(`${formatLocated(result.error)}\n`);
    return EXIT_BAD_INPUT;
  }
  const clinical = result.value.caseFile.clinical;
  io.out(
    [
      `report  ${result.value.outPath} (${result.value.bytes} bytes, ${certificate ? 'signed' : 'unsigned'})`,
      `case    ${result.value.casePath}`,
      `locale  ${result.value.caseFile.reportLocale ?? 'en'} (numbers and dates in the report)`,
      ...amended.map((c) => `amended ${describeChange(c)}`),
      'clinical inputs used:',
      `  ${clinicalLine(1, clinical.day1)}`,
      `  ${clinicalLine(2, clinical.day2)}`,
      '',
    ].join('\n'),
  );
  return EXIT_OK;
}
