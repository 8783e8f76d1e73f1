/**
 * writeBreathCsv(table): the breath table in Twofold's own plain CSV layout.
 *
 * Layout (UTF-8, LF line ends, comma delimiter, dot decimals, empty cell for a missing value):
 *   # subject_id: QX-0001        metadata lines, `# key: value`, only for known values, in
 *   # age: 40                    this order: subject_id, age, sex (F|M), height_cm, weight_kg,
 *   ...                          test_start (ISO 8601), modality (cycle|treadmill), protocol,
 *                                barometric_mmhg, then the table's extra pairs as given
 *   time_s,vo2_ml_min,vco2_ml_min,ve_l_min[,hr_bpm,...][,rpe]
 *   12.5,310,262,9.8,...
 * The first four columns are always written; each further column (in the order of
 * BREATH_COLUMNS) only when at least one breath has a value for it. With RPE readings, a last
 * `rpe` column carries each rating on the breath nearest its time and is blank elsewhere
 * (two ratings nearest the same breath: the later one is written).
 * Numbers are written in the shortest form that reads back to the same value, never in
 * exponent notation; a non-finite number is written as an empty cell.
 *
 * Example: one breath {timeS 1.5, vo2MlMin 300, vco2MlMin 250, veLMin 9.1, others null}, no
 * metadata → "time_s,vo2_ml_min,vco2_ml_min,ve_l_min\n1.5,300,250,9.1\n".
 */
import type { Breath, BreathTable, BreathVariable, TestMetadata } from '../model/breath-table';

/** Column names of the layout, by breath variable, in the order they are written. */
export const BREATH_COLUMNS: readonly { readonly key: BreathVariable; readonly name: string; readonly always: boolean }[] = [
  { key: 'timeS', name: 'time_s', always: true },
  { key: 'vo2MlMin', name: 'vo2_ml_min', always: true },
  { key: 'vco2MlMin', name: 'vco2_ml_min', always: true },
  { key: 'veLMin', name: 've_l_min', always: true },
  { key: 'hrBpm', name: 'hr_bpm', always: false },
  { key: 'workW', name: 'work_w', always: false },
  { key: 'speedKmh', name: 'speed_kmh', always: false },
  { key: 'gradePct', name: 'grade_pct', always: false },
  { key: 'peto2Mmhg', name: 'peto2_mmhg', always: false },
  { key: 'petco2Mmhg', name: 'petco2_mmhg', always: false },
  { key: 'rrPerMin', name: 'rr_per_min', always: false },
  { key: 'vtL', name: 'vt_l', always: false },
];

export const RPE_COLUMN = 'rpe';

/** A number as text: shortest round-trip form, no exponent; empty when null or not finite. */
export function formatCsvNumber(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return '';
  const text = String(value);
  if (!/e/i.test(text)) return text;
  // Exponent forms appear only below 1e-6 or from 1e21; fixed notation with trailing zeros trimmed.
  return value.toFixed(20).replace(/\.?0+$/, '');
}

/** Metadata values never span lines: a line break inside one becomes a space. */
function oneLine(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').trim();
}

function metadataLines(metadata: TestMetadata): string[] {
  const known: [string, string | number | null][] = [
    ['subject_id', metadata.subjectId],
    ['age', metadata.ageY],
    ['sex', metadata.sex],
    ['height_cm', metadata.heightCm],
    ['weight_kg', metadata.weightKg],
    ['test_start', metadata.testStart],
    ['modality', metadata.modality],
    ['protocol', metadata.protocol],
    ['barometric_mmhg', metadata.barometricMmhg],
  ];
  const lines: string[] = [];
  for (const [key, value] of known) {
    if (value === null) continue;
    lines.push(`# ${key}: ${typeof value === 'number' ? formatCsvNumber(value) : oneLine(value)}`);
  }
  for (const [key, value] of Object.entries(metadata.extra)) lines.push(`# ${oneLine(key)}: ${oneLine(value)}`);
  return lines;
}

/** Index of the breath whose time is nearest `timeS` (the earlier on a tie); breaths sorted by time. */
function nearestBreath(breaths: readonly Breath[], timeS: number): number {
  let lo = 0;
  let hi = breaths.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (breaths[mid].timeS < timeS) lo = mid + 1;
    else hi = mid;
  }
  if (lo > 0 && Math.abs(breaths[lo - 1].timeS - timeS) <= Math.abs(breaths[lo].timeS - timeS)) return lo - 1;
  return lo;
}

export function writeBreathCsv(table: BreathTable): string {
  const { breaths } = table;
  const columns = BREATH_COLUMNS.filter((c) => c.always || breaths.some((b) => b[c.key] !== null));
  const rpeByBreath = new Map<number, number>();
  if (breaths.length > 0) {
    const sorted = [...table.rpe].sort((a, b) => a.timeS - b.timeS);
    for (const reading of sorted) rpeByBreath.set(nearestBreath(breaths, reading.timeS), reading.borg);
  }
  const withRpe = rpeByBreath.size > 0;
  const header = [...columns.map((c) => c.name), ...(withRpe ? [RPE_COLUMN] : [])].join(',');
  const rows = breaths.map((b, i) => {
    const cells = columns.map((c) => formatCsvNumber(b[c.key]));
    if (withRpe) cells.push(formatCsvNumber(rpeByBreath.get(i) ?? null));
    return cells.join(',');
  });
  return [...metadataLines(table.metadata), header, ...rows].join('\n') + '\n';
}
