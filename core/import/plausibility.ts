/**
 * Per-breath plausibility flags. Limits come from `settings.import.implausible`
 * (VO2 above 8,000 mL/min, HR outside 25–250 bpm, RER = VCO2/VO2 outside 0.5–2.0 by
 * default; common practice, no single source). VO2 or VCO2 at or below zero is flagged too:
 * a body at rest still takes up oxygen. A flagged breath stays in the table: flags ask for
 * a second look, the cleaning step decides.
 * When the file carries the cart's own RER, it is compared with VCO2/VO2 and a difference
 * above `settings.import.rerMismatch` is flagged (a sign of a column mix-up or unit error).
 * Borg ratings outside 6–20 (Borg 1982) are flagged.
 * Values outside physiology, whatever the settings (PHYSIOLOGY below): VE at or below zero or
 * above 400 L/min, work below 0 or above 3,000 W, PetO2 or PetCO2 below 0 or above 760 mmHg.
 */
import type { Breath, RpeReading } from '../model/breath-table';
import { locatedError } from '../model/errors';
import { shortNumber } from '../locale/format-number';
import type { Settings } from '../model/settings';
import type { ColumnReport, RowFlag } from './types';

/**
 * Hard limits of physiology, not lab settings: the highest minute ventilations recorded in
 * elite endurance athletes are about 200–300 L/min (memory), so 400 L/min is none a person
 * breathes; a cycle ramp test peaks at a few hundred watts and sprint power near 2,000 W
 * (memory), so above 3,000 W is a unit or column error (common practice, no source); a
 * partial pressure cannot exceed the total pressure, 760 mmHg at sea level (physics).
 */
export const PHYSIOLOGY = { veMaxLMin: 400, workMaxW: 3000, petMaxMmhg: 760 } as const;

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

export function plausibilityFlags(
  breaths: readonly Breath[],
  fileRer: readonly (number | null)[],
  rpe: readonly RpeReading[],
  columns: readonly ColumnReport[],
  settings: Settings['import'],
  file: string,
): RowFlag[] {
  const lim = settings.implausible;
  const colOf = (v: string) => columns.find((c) => c.variable === v)?.index ?? null;
  const vo2Col = colOf('vo2MlMin') ?? colOf('vo2MlKgMin');
  const vco2Col = colOf('vco2MlMin');
  const hrCol = colOf('hrBpm');
  const rerCol = colOf('rer');
  const veCol = colOf('veLMin');
  const workCol = colOf('workW');
  const flags: RowFlag[] = [];
  const flag = (b: Breath, code: string, column: number | null, variable: RowFlag['variable'], value: number, message: string) =>
    flags.push({ ...locatedError(code, file, b.sourceLine, column, message), timeS: b.timeS, variable, value });

  for (let i = 0; i < breaths.length; i++) {
    const b = breaths[i];
    if (b.vo2MlMin > lim.vo2MaxMlMin) {
      flag(b, 'implausible-vo2', vo2Col, 'vo2MlMin', b.vo2MlMin, `VO2 of ${shortNumber(Math.round(b.vo2MlMin))} mL/min is above the plausible ${lim.vo2MaxMlMin} mL/min; check the unit or the sensor.`);
    }
    if (b.vo2MlMin <= 0 || b.vco2MlMin <= 0) {
      const which = b.vo2MlMin <= 0 ? 'VO2' : 'VCO2';
      flag(b, 'implausible-gas', b.vo2MlMin <= 0 ? vo2Col : vco2Col, b.vo2MlMin <= 0 ? 'vo2MlMin' : 'vco2MlMin', b.vo2MlMin <= 0 ? b.vo2MlMin : b.vco2MlMin, `${which} is zero or negative on this breath; no living subject gives that.`);
    } else {
      const rer = b.vco2MlMin / b.vo2MlMin;
      if (rer < lim.rerMin || rer > lim.rerMax) {
        flag(b, 'implausible-rer', null, 'rer', rer, `RER (VCO2/VO2) of ${round(rer, 2)} is outside the plausible ${lim.rerMin}–${lim.rerMax}.`);
      }
      const own = fileRer[i];
      if (own !== null && own !== undefined && Math.abs(own - rer) > settings.rerMismatch) {
        flag(b, 'rer-mismatch', rerCol, 'rer', own, `The file's RER ${round(own, 3)} differs from VCO2/VO2 = ${round(rer, 3)} by more than ${settings.rerMismatch}; check that VO2 and VCO2 are the right columns and units.`);
      }
    }
    if (b.hrBpm !== null && (b.hrBpm < lim.hrMinBpm || b.hrBpm > lim.hrMaxBpm)) {
      flag(b, 'implausible-hr', hrCol, 'hrBpm', b.hrBpm, `HR of ${shortNumber(b.hrBpm)} bpm is outside the plausible ${lim.hrMinBpm}–${lim.hrMaxBpm} bpm.`);
    }
    if (!(b.veLMin > 0 && b.veLMin <= PHYSIOLOGY.veMaxLMin)) {
      flag(b, 'implausible-ve', veCol, 'veLMin', b.veLMin, `VE of ${shortNumber(b.veLMin)} L/min is outside physiology (above 0, at most ${PHYSIOLOGY.veMaxLMin} L/min).`);
    }
    if (b.workW !== null && !(b.workW >= 0 && b.workW <= PHYSIOLOGY.workMaxW)) {
      flag(b, 'implausible-work', workCol, 'workW', b.workW, `Work of ${shortNumber(b.workW)} W is outside physiology (0 to ${PHYSIOLOGY.workMaxW} W).`);
    }
    for (const [key, name] of [['peto2Mmhg', 'PetO2'], ['petco2Mmhg', 'PetCO2']] as const) {
      const v = b[key];
      if (v !== null && !(v >= 0 && v <= PHYSIOLOGY.petMaxMmhg)) {
        flag(b, 'implausible-pet', colOf(key), key, v, `${name} of ${shortNumber(v)} mmHg is outside physiology (0 to ${PHYSIOLOGY.petMaxMmhg} mmHg, the pressure of the air at sea level).`);
      }
    }
  }
  const rpeCol = colOf('rpe');
  for (const r of rpe) {
    if (r.borg < 6 || r.borg > 20) {
      flags.push({
        ...locatedError('implausible-rpe', file, null, rpeCol, `A Borg rating of ${r.borg} at ${round(r.timeS, 1)} s is outside the 6–20 scale.`),
        timeS: r.timeS,
        variable: 'rpe',
        value: r.borg,
      });
    }
  }
  return flags;
}
