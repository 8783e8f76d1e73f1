/**
 * Invented layout "tabbed-units-clock": three tab-separated label/value lines, a blank line,
 * a tab-delimited header, a units row under it, then the rows. Time is the wall-clock time
 * h:mm:ss (whole seconds, from the test start's own clock), end-tidal pressures are in kPa,
 * tidal volume in mL. UTF-8, LF line ends, dot decimals.
 */
import type { BreathTable } from '../../core/model/breath-table';
import { clockStartS, clockTime, fixed, isoDate, MMHG_TO_KPA, rpeByBreath } from './text-cells';

export function writeTabbedUnitsClock(table: BreathTable): string {
  const m = table.metadata;
  const start = clockStartS(m.testStart ?? '');
  const top = [`Subject\t${m.subjectId ?? ''}`, `Date\t${isoDate(m.testStart ?? '')}`, `Start\t${clockTime(start)}`, ''];
  const header = ['Clock', 'O2 uptake', 'CO2 output', 'Ventilation', 'Heart rate', 'Work rate', 'End-tidal O2', 'End-tidal CO2', 'Resp. rate', 'Tidal vol.', 'RPE'];
  const units = ['h:mm:ss', 'ml/min', 'ml/min', 'l/min', 'bpm', 'W', 'kPa', 'kPa', '/min', 'ml', 'Borg'];
  const rpe = rpeByBreath(table);
  const kpa = (mmhg: number | null) => (mmhg === null ? null : mmhg * MMHG_TO_KPA);
  const rows = table.breaths.map((b) =>
    [
      clockTime(start + b.timeS),
      fixed(b.vo2MlMin, 0),
      fixed(b.vco2MlMin, 0),
      fixed(b.veLMin, 2),
      fixed(b.hrBpm, 0),
      fixed(b.workW, 0),
      fixed(kpa(b.peto2Mmhg), 2),
      fixed(kpa(b.petco2Mmhg), 2),
      fixed(b.rrPerMin, 1),
      fixed(b.vtL === null ? null : b.vtL * 1000, 0),
      rpe.has(b) ? String(rpe.get(b)) : '',
    ].join('\t'),
  );
  return [...top, header.join('\t'), units.join('\t'), ...rows].join('\n') + '\n';
}
