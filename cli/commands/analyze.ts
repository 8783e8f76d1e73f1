/**
 * `twofold analyze FILE`: thresholds, peaks, derived and predicted values and the effort
 * verdict of one test. The shell reads the files and the flags; every number comes from
 * core/analyze. Flags about the person override the file's metadata. Exit 0 when the test
 * was analysed, 2 for bad input (`FILE:LINE:COLUMN: message`), 1 for anything else.
 */
import { resolve } from 'node:path';
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import { summaryJson } from '../../core/analyze/summary-json';
import { readBreathFile } from '../../core/import/read-table';
import { refuseImpossible } from '../../core/import/sanity';
import { boundedFixed } from '../../core/locale/format-number';
import { minSec } from '../../core/locale/min-sec';
import type { BreathTable, TestMetadata } from '../../core/model/breath-table';
import type { ClinicalInputs, TestAnalysis, ThresholdResult } from '../../core/model/analysis';
import { fail, formatLocated, locatedError, type LocatedError, type Result } from '../../core/model/errors';
import type { ImportResult } from '../../core/import/types';
import { DEFAULT_SETTINGS, type Settings } from '../../core/model/settings';
import { readFileBytes } from '../../host/read-bytes';
import { numberFlag, parseFlags } from '../args';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CliIo } from '../io';

const USAGE = `usage: twofold analyze FILE [--json] [--settings FILE] [--age N] [--sex F|M]
         [--height-cm N] [--weight-kg N] [--modality cycle|treadmill]
         [--rpe N] [--lactate MMOL] [--fev1-l N | --mvv-l-min N]

  --json              print the analysis as one JSON object
  --settings FILE     a JSON partial of the settings, merged over the defaults
  --age, --sex, --height-cm, --weight-kg, --modality
                      the person and the ergometer (override the file's metadata)
  --rpe N             peak Borg 6–20 rating (overrides ratings in the file)
  --lactate MMOL      peak blood lactate, mmol/L
  --fev1-l N          FEV1, L (MVV is estimated as FEV1 × 40)
  --mvv-l-min N       measured MVV, L/min
`;

const OPTIONS = {
  json: { type: 'boolean' },
  settings: { type: 'string' },
  age: { type: 'string' },
  sex: { type: 'string' },
  'height-cm': { type: 'string' },
  'weight-kg': { type: 'string' },
  modality: { type: 'string' },
  rpe: { type: 'string' },
  lactate: { type: 'string' },
  'fev1-l': { type: 'string' },
  'mvv-l-min': { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

const CAUTION =
  'Twofold supports licensed clinicians; it does not diagnose. Two-day maximal testing can provoke prolonged symptom flares: ' +
  'screening, consent and supervision are the lab’s responsibility. Follow local regulations and licensed practice.';

function readBytes(path: string, shown: string): Uint8Array | LocatedError {
  try {
    return readFileBytes(path);
  } catch (error) {
    const why = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : error instanceof Error ? error.message : String(error);
    return locatedError('unreadable-file', shown, null, null, `The file cannot be read (${why}).`);
  }
}

function ranged(name: string, raw: string | undefined, min: number, max: number): number | undefined {
  const value = numberFlag(name, raw);
  if (value !== undefined && (value < min || value > max)) throw new UsageError(`--${name} expects a value from ${min} to ${max}, got ${value}`);
  return value;
}

type Values = ReturnType<typeof parseFlags<typeof OPTIONS>>['values'];

function metadataOverrides(v: Values): Partial<TestMetadata> {
  const out: { -readonly [K in keyof TestMetadata]?: TestMetadata[K] } = {};
  const age = ranged('age', v.age, 1, 120);
  if (age !== undefined) out.ageY = age;
  if (v.sex !== undefined) {
    const sex = v.sex.toUpperCase();
    if (sex !== 'F' && sex !== 'M') throw new UsageError(`--sex expects F or M, got '${v.sex}'`);
    out.sex = sex;
  }
  const height = ranged('height-cm', v['height-cm'], 50, 250);
  if (height !== undefined) out.heightCm = height;
  const weight = ranged('weight-kg', v['weight-kg'], 10, 400);
  if (weight !== undefined) out.weightKg = weight;
  if (v.modality !== undefined) {
    if (v.modality !== 'cycle' && v.modality !== 'treadmill') throw new UsageError(`--modality expects cycle or treadmill, got '${v.modality}'`);
    out.modality = v.modality;
  }
  return out;
}

function clinicalInputs(v: Values): ClinicalInputs {
  if (v['fev1-l'] !== undefined && v['mvv-l-min'] !== undefined) throw new UsageError('give either --fev1-l or --mvv-l-min, not both');
  return {
    ...noClinicalInputs(),
    peakRpe: ranged('rpe', v.rpe, 6, 20) ?? null,
    lactateMmolL: ranged('lactate', v.lactate, 0, 40) ?? null,
    fev1L: ranged('fev1-l', v['fev1-l'], 0.2, 9) ?? null,
    mvvLMin: ranged('mvv-l-min', v['mvv-l-min'], 5, 400) ?? null,
  };
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseFlags(args, OPTIONS);
  if (values.help) {
    io.out(USAGE);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`expected one breath file\n\n${USAGE}`);
  const overrides = metadataOverrides(values);
  const clinical = clinicalInputs(values);

  let settings: Settings = DEFAULT_SETTINGS;
  if (values.settings !== undefined) {
    const bytes = readBytes(resolve(io.cwd, values.settings), values.settings);
    if (!(bytes instanceof Uint8Array)) return badInput(io, bytes);
    // The settings validator (zod) loads only when a settings file is given.
    const { settingsFromJson } = await import('../../core/analyze/settings-input');
    const parsed = settingsFromJson(new TextDecoder().decode(bytes), values.settings);
    if (!parsed.ok) return badInput(io, parsed.error);
    settings = parsed.value;
  }

  const file = positionals[0];
  const imported = await importFile(resolve(io.cwd, file), file, settings);
  if (!imported.ok) return badInput(io, imported.error);

  const impossible = refuseImpossible(imported.value, file);
  if (impossible) return badInput(io, impossible);
  const table: BreathTable = { ...imported.value.table, metadata: { ...imported.value.table.metadata, ...overrides } };
  const analysis = analyzeTest(table, settings, clinical);
  const importNotes = [...imported.value.warnings, ...imported.value.rejected].map(formatLocated);
  if (values.json) {
    io.out(`${JSON.stringify({ ...summaryJson(analysis), import_notes: importNotes }, null, 2)}\n`);
  } else {
    io.out(readable(analysis, importNotes));
  }
  return EXIT_OK;
}

/** Reads and imports the breath file in a frame of its own, so its bytes are released once the table is read. */
async function importFile(path: string, shown: string, settings: Settings): Promise<Result<ImportResult>> {
  const bytes = readBytes(path, shown);
  if (!(bytes instanceof Uint8Array)) return fail(bytes);
  return readBreathFile(bytes, { sourceName: shown, settings });
}

function badInput(io: CliIo, error: LocatedError): number {
  io.err(`${formatLocated(error)}\n`);
  return EXIT_BAD_INPUT;
}

/** A value with its unit, in bounded digits ('≥ 10⁹' beyond a billion, core/locale/format-number.ts). */
function f(x: number | null | undefined, decimals: number, unit: string): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '—' : `${boundedFixed(x, decimals)}${unit ? ' ' + unit : ''}`;
}

/** A time of the recording as m:ss, by the one formatter (core/locale/min-sec.ts). */
function clockText(x: number | null | undefined): string {
  return minSec(x, '—');
}

function thresholdLines(t: ThresholdResult): string[] {
  const name = t.id.toUpperCase();
  if (!t.at) return [`${name}: not found (${t.reason ?? 'no method found a breakpoint'})`];
  const a = t.at;
  const ci = t.ci95Vo2MlMin ? `, 95% CI ${f(t.ci95Vo2MlMin[0], 0, '')}–${f(t.ci95Vo2MlMin[1], 0, 'mL/min')}` : '';
  const lines = [
    `${name}: VO2 ${f(a.vo2MlMin, 0, 'mL/min')} (${f(a.vo2MlKgMin, 1, 'mL/kg/min')}, ${f(a.pctPeakVo2, 0, '% of peak')})${ci}`,
    `      at ${clockText(a.timeS)} (m:ss), work ${f(a.workW, 0, 'W')}, HR ${f(a.hrBpm, 0, 'bpm')}, VE ${f(a.veLMin, 1, 'L/min')}, RER ${f(a.rer, 2, '')}`,
  ];
  for (const m of t.methods) {
    lines.push(m.found ? `      ${m.label}: ${f(m.vo2MlMin, 0, 'mL/min')} at ${clockText(m.timeS)}` : `      ${m.label}: not found (${m.reason})`);
  }
  if (t.methodsDisagree) lines.push(`      methods disagree: spread ${f(t.spreadVo2MlMin, 0, 'mL/min')}`);
  return lines;
}

function readable(a: TestAnalysis, importNotes: readonly string[]): string {
  const p = a.peak;
  const d = a.derived;
  const r = a.predicted;
  const lines = [
    `${a.sourceName} — ${a.provenance.software} ${a.provenance.softwareVersion}`,
    `Phases: incremental ${clockText(a.phases.incrementalStartS)} to ${clockText(a.phases.incrementalEndS)} (m:ss; ${clockText(p.exerciseDurationS)} long), ramp ${f(a.phases.rampWPerMin, 1, 'W/min')} (${a.phases.source})`,
    `Breaths left out (values outside physiology, outliers): ${a.removedBreaths.length}`,
    '',
    ...thresholdLines(a.vt1),
    ...thresholdLines(a.vt2),
    '',
    `Peak: VO2 ${f(p.vo2MlMin, 0, 'mL/min')} (${f(p.vo2MlKgMin, 1, 'mL/kg/min')}, ${f(p.mets, 1, 'METs')}), VCO2 ${f(p.vco2MlMin, 0, 'mL/min')}, RER ${f(p.rer, 2, '')}`,
    `      HR ${f(p.hrBpm, 0, 'bpm')}, O2 pulse ${f(p.o2PulseMlBeat, 1, 'mL/beat')}, work ${f(p.workW, 0, 'W')}, VE ${f(p.veLMin, 1, 'L/min')}`,
    `Derived: VE/VCO2 slope ${f(d.veVco2Slope, 1, '')}, OUES ${f(d.oues, 0, 'mL/min per log10(L/min)')}, ΔVO2/ΔWR ${f(d.dVo2dWrMlMinW, 1, 'mL/min/W')}`,
    `      breathing reserve ${f(d.breathingReserveLMin, 1, 'L/min')} (${f(d.breathingReservePct, 0, '%')}), HR reserve ${f(d.hrReserveBpm, 0, 'bpm')}, Weber class ${d.weberClass ?? '—'}`,
    `Predicted: HRmax ${f(r.hrMaxBpm, 0, 'bpm')}, FRIEND ${f(r.friendVo2MlKgMin, 1, 'mL/kg/min')} (${f(r.pctPredictedFriend, 0, '%')} reached), Hansen ${f(r.hansenVo2MlMin, 0, 'mL/min')} (${f(r.pctPredictedHansen, 0, '%')} reached)`,
    '',
    `Effort: ${a.effort.verdict}`,
    ...a.effort.reasons.map((x) => `  ${x}`),
  ];
  if (a.warnings.length > 0) lines.push('', 'Warnings:', ...a.warnings.map((w) => `  ${w}`));
  if (importNotes.length > 0) lines.push('', 'Import notes:', ...importNotes.map((w) => `  ${w}`));
  lines.push('', CAUTION, '');
  return lines.join('\n');
}
