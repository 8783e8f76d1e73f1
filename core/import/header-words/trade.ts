/**
 * Abbreviations of the trade that labs write the same way whatever their language
 * (VO2, VCO2, VE, PetO2, PetCO2, RER, RQ, Vt, Borg, W): they name a column but say nothing
 * about the language of the file, so they never count towards recognising it.
 */
import type { ColumnMeaning } from './types';

export const TRADE_WORDS: Readonly<Partial<Record<ColumnMeaning, readonly string[]>>> = {
  vo2MlMin: ['VO2', "V'O2", 'V.O2'],
  vco2MlMin: ['VCO2', "V'CO2", 'V.CO2'],
  veLMin: ['VE', "V'E", 'V.E'],
  peto2Mmhg: ['PetO2', 'PETO2', 'etO2'],
  petco2Mmhg: ['PetCO2', 'PETCO2', 'etCO2'],
  vtL: ['Vt', 'VTex'],
  vo2MlKgMin: ['VO2/kg', 'VO2kg'],
  rer: ['RER', 'RQ'],
  rpe: ['RPE', 'Borg', 'Borg RPE'],
  workW: ['Watt', 'Watts'],
};
