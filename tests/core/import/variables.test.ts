// Reference: header spellings of the trade (common practice): V'O2 / V.O2 / VO2 STPD for
// oxygen uptake, BF / RR for breathing frequency, RQ for RER, units in brackets.
import { describe, expect, test } from 'vitest';
import { matchVariable, readHeaderCell, splitHeader } from '../../../core/import/variables';

describe('header names', () => {
  test('splitHeader takes the unit out of brackets, parentheses or a trailing x/y word', () => {
    expect(splitHeader("V'O2 STPD [L/min]")).toEqual({ name: "V'O2 STPD", unit: 'L/min' });
    expect(splitHeader('Time (s)')).toEqual({ name: 'Time', unit: 's' });
    expect(splitHeader('VO2 mL/min')).toEqual({ name: 'VO2', unit: 'mL/min' });
    expect(splitHeader('VO2/kg')).toEqual({ name: 'VO2/kg', unit: null });
  });

  test.each([
    ['t', 'timeS'],
    ['TIME', 'timeS'],
    ["V'O2", 'vo2MlMin'],
    ['V.O2', 'vo2MlMin'],
    ['VO2 STPD', 'vo2MlMin'],
    ['vo2/kg', 'vo2MlKgMin'],
    ["V'CO2", 'vco2MlMin'],
    ["V'E", 'veLMin'],
    ['hr', 'hrBpm'],
    ['Load', 'workW'],
    ['Power', 'workW'],
    ['Watts', 'workW'],
    ['Speed', 'speedKmh'],
    ['Grade', 'gradePct'],
    ['PetO2', 'peto2Mmhg'],
    ['PETCO2', 'petco2Mmhg'],
    ['BF', 'rrPerMin'],
    ['RR', 'rrPerMin'],
    ['VT', 'vtL'],
    ['RER', 'rer'],
    ['RQ', 'rer'],
    ['Borg', 'rpe'],
    ['RPE', 'rpe'],
  ])('%s → %s', (header, variable) => {
    expect(matchVariable(splitHeader(header).name)).toBe(variable);
  });

  test('ratios and thresholds are not variables', () => {
    expect(matchVariable('VE/VO2')).toBeNull();
    expect(matchVariable('VT1')).toBeNull();
    expect(matchVariable('VO2/HR')).toBeNull();
  });

  test('our plain layout names carry their unit', () => {
    expect(readHeaderCell('vo2_ml_min')).toEqual({ variable: 'vo2MlMin', name: 'vo2_ml_min', unit: 'mL/min' });
    expect(readHeaderCell('time_s').unit).toBe('s');
  });
});
