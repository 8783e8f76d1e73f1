/**
 * Predicted values for one person.
 *
 * - HRmax, bpm: Tanaka et al., J Am Coll Cardiol 2001;37:153–6: 208 − 0.7 × age;
 *   Fox et al. 1971: 220 − age. Age in years.
 * - FRIEND VO2max, mL/kg/min (de Souza e Silva et al., Eur J Prev Cardiol 2018;25:742–50;
 *   coefficients confirmed against the published abstract; SEE 6.6 mL/kg/min):
 *   45.2 − 0.35·age − 10.9·sex(male 1, female 2) − 0.15·weight(lb) + 0.68·height(in)
 *   − 0.46·mode(treadmill 1, cycle 2).
 * - Hansen/Wasserman peak VO2, mL/min, cycle ergometer (Hansen et al., Am Rev
 *   Respir Dis 1984;129:S49–55). Written from memory, not looked up — verify before relying
 *   on it: men W × (50.72 − 0.372·age), women (W + 43) × (22.78 − 0.17·age), with W the
 *   actual weight in kg, or the predicted weight when actual exceeds it (men 0.79·height(cm)
 *   − 60.7, women 0.65·height(cm) − 42.8) (memory); treadmill × 1.11 (memory).
 *
 * Example: woman, 45 y, 150 lb (68.04 kg), 65 in (165.1 cm), cycle → FRIEND 28.43 mL/kg/min.
 */
import type { Modality, Sex } from '../model/breath-table';
import type { HrMaxFormula } from '../model/settings';

export const KG_PER_LB = 0.45359237;
export const CM_PER_IN = 2.54;

export function hrMaxTanaka(ageY: number): number {
  return 208 - 0.7 * ageY;
}

export function hrMaxFox(ageY: number): number {
  return 220 - ageY;
}

export function predictedHrMax(ageY: number, formula: HrMaxFormula): number {
  return formula === 'tanaka' ? hrMaxTanaka(ageY) : hrMaxFox(ageY);
}

export interface Person {
  readonly ageY: number;
  readonly sex: Sex;
  readonly heightCm: number;
  readonly weightKg: number;
  readonly modality: Modality;
}

/** FRIEND registry equation, mL/kg/min. */
export function friendVo2MlKgMin(p: Person): number {
  const sex = p.sex === 'M' ? 1 : 2;
  const mode = p.modality === 'treadmill' ? 1 : 2;
  const lb = p.weightKg / KG_PER_LB;
  const inches = p.heightCm / CM_PER_IN;
  return 45.2 - 0.35 * p.ageY - 10.9 * sex - 0.15 * lb + 0.68 * inches - 0.46 * mode;
}

/** Hansen/Wasserman predicted peak VO2, mL/min (memory; see the module comment). */
export function hansenVo2MlMin(p: Person): number {
  const predictedWeight = p.sex === 'M' ? 0.79 * p.heightCm - 60.7 : 0.65 * p.heightCm - 42.8;
  const w = Math.min(p.weightKg, predictedWeight);
  const cycle = p.sex === 'M' ? w * (50.72 - 0.372 * p.ageY) : (w + 43) * (22.78 - 0.17 * p.ageY);
  return p.modality === 'treadmill' ? cycle * 1.11 : cycle;
}

/** Measured as a percentage of predicted; null when either is missing or predicted ≤ 0. */
export function percentOf(measured: number | null, predicted: number | null): number | null {
  if (measured === null || predicted === null || !(predicted > 0) || !Number.isFinite(measured)) return null;
  return (100 * measured) / predicted;
}
