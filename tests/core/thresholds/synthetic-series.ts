/**
 * A processed series from a stated model, for detector tests (not the project's generator):
 * - incremental phase from 120 s to 840 s, one averaged point every 2 s, rest before it;
 * - VO2 rises linearly from 800 to 3,200 mL/min over the ramp (10 mL/min per W at 20 W/min);
 * - VCO2 = 0.92·VO2 − 40 below VT1 (VO2 1,700 mL/min), slope 1.37 above (V-slope model,
 *   Beaver et al. 1986: slope near 1 below, steeper above);
 * - VE/VCO2 is 27 below VT2 (VO2 2,600 mL/min); above it VE rises 0.08 L/min per extra mL/min
 *   of VCO2 beyond VCO2 at VT2 (respiratory compensation);
 * - PetCO2 from the alveolar ventilation equation, 863 × VCO2 / VA with VA = 0.8 × VE;
 * - PetO2 from the alveolar gas equation, PIO2 − PACO2 × (FIO2 + (1 − FIO2)/R), PIO2 = (760 − 47) × 0.2093.
 * Optional Gaussian noise (seeded) as a fraction of each value.
 */
import type { ProcessedSeries } from '../../../core/model/analysis';
import { normalRandom, seededRandom } from '../../../core/math/random';

export const TRUE_VT1_VO2 = 1700;
export const TRUE_VT2_VO2 = 2600;
export const INC_START_S = 120;
export const INC_END_S = 840;

export function vo2AtTime(t: number): number {
  if (t <= INC_START_S) return 800;
  return 800 + (2400 * (Math.min(t, INC_END_S) - INC_START_S)) / (INC_END_S - INC_START_S);
}

export function timeAtVo2(vo2: number): number {
  return INC_START_S + ((vo2 - 800) * (INC_END_S - INC_START_S)) / 2400;
}

export interface SyntheticOptions {
  readonly noise?: number;
  readonly seed?: number;
  readonly endTidal?: boolean;
  /** Replace the VT1 bend by a straight VCO2 = 0.95 · VO2. */
  readonly noVt1?: boolean;
}

export function syntheticSeries(opts: SyntheticOptions = {}): ProcessedSeries {
  const gauss = normalRandom(seededRandom(opts.seed ?? 1));
  const noise = opts.noise ?? 0;
  const jitter = (v: number) => v * (1 + noise * gauss());
  const vco2At = (vo2: number) => (opts.noVt1 ? 0.95 * vo2 : 0.92 * vo2 - 40 + 0.45 * Math.max(0, vo2 - TRUE_VT1_VO2));
  const vco2Vt2 = vco2At(TRUE_VT2_VO2);
  const s = { timeS: [] as number[], vo2MlMin: [] as number[], vco2MlMin: [] as number[], veLMin: [] as number[], hrBpm: [] as (number | null)[], workW: [] as (number | null)[], peto2Mmhg: [] as (number | null)[], petco2Mmhg: [] as (number | null)[] };
  for (let t = 0; t <= INC_END_S; t += 2) {
    const vo2 = vo2AtTime(t);
    const vco2 = vco2At(vo2);
    const ve = (27 * vco2) / 1000 + 0.08 * Math.max(0, vco2 - vco2Vt2);
    const paco2 = (863 * vco2) / 1000 / (0.8 * ve);
    const r = vco2 / vo2;
    const pao2 = (760 - 47) * 0.2093 - paco2 * (0.2093 + (1 - 0.2093) / r);
    s.timeS.push(t);
    s.vo2MlMin.push(jitter(vo2));
    s.vco2MlMin.push(jitter(vco2));
    s.veLMin.push(jitter(ve));
    s.hrBpm.push(70 + (vo2 - 800) / 20);
    s.workW.push(t <= INC_START_S ? 0 : (20 * (t - INC_START_S)) / 60);
    s.peto2Mmhg.push(opts.endTidal === false ? null : jitter(pao2));
    s.petco2Mmhg.push(opts.endTidal === false ? null : jitter(paco2));
  }
  return s;
}
