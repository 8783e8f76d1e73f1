/**
 * Invented layout "narrative-semicolon": a free-text preamble of labelled lines, a blank
 * line, then a semicolon-delimited table with decimal commas, VO2 and VCO2 in L/min, elapsed
 * time as mm:ss (whole seconds, so two breaths may share a second), and a sparse Borg column.
 * Latin-1-safe ASCII text, LF line ends.
 */
import type { BreathTable } from '../../core/model/breath-table';
import { fixed, minutesSeconds, rpeByBreath, sexWord } from './text-cells';

export function writeNarrativeSemicolon(table: BreathTable, labName: string): string {
  const m = table.metadata;
  const preamble = [
    labName,
    'Breath-by-breath record, one row per breath',
    `Patient code: ${m.subjectId ?? ''}`,
    `Age (years): ${m.ageY ?? ''}`,
    `Sex: ${sexWord(m.sex)}`,
    `Height (cm): ${fixed(m.heightCm, 0, ',')}`,
    `Weight (kg): ${fixed(m.weightKg, 1, ',')}`,
    `Test started: ${m.testStart ?? ''}`,
    `Exercise: ${m.modality === 'treadmill' ? 'treadmill' : 'cycle ergometer'}; ${m.protocol ?? ''}`,
    `Air pressure (mmHg): ${fixed(m.barometricMmhg, 0, ',')}`,
    'Remarks: values are as measured; no breaths removed.',
    '',
  ];
  const header = 'Time;VO2 (L/min);VCO2 (L/min);VE (L/min);HR (1/min);Power (W);PetO2 (mmHg);PetCO2 (mmHg);Breaths/min;Vt (L);Borg';
  const rpe = rpeByBreath(table);
  const rows = table.breaths.map((b) =>
    [
      minutesSeconds(b.timeS),
      fixed(b.vo2MlMin / 1000, 3, ','),
      fixed(b.vco2MlMin / 1000, 3, ','),
      fixed(b.veLMin, 2, ','),
      fixed(b.hrBpm, 0, ','),
      fixed(b.workW, 0, ','),
      fixed(b.peto2Mmhg, 1, ','),
      fixed(b.petco2Mmhg, 1, ','),
      fixed(b.rrPerMin, 1, ','),
      fixed(b.vtL, 3, ','),
      rpe.has(b) ? String(rpe.get(b)) : '',
    ].join(';'),
  );
  return [...preamble, header, ...rows].join('\n') + '\n';
}
