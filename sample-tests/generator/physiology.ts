/**
 * The noise-free equations of the test-data model, one pure function per relation.
 * Units live in the names; VO2 and VCO2 in mL/min (STPD), VE in L/min (BTPS).
 *
 * Sources, per function: the alveolar ventilation and alveolar gas equations are textbook
 * physiology (worked values in /work/shared/check-values.md); the ACSM walking equation,
 * the unloaded-cycling cost and the tidal-volume curve are recalled, marked "(memory)".
 */

/** Water vapour pressure at 37 °C, mmHg (textbook physiology). */
export const WATER_VAPOUR_MMHG = 47;
/** Fraction of O2 in dry room air (textbook physiology). */
export const ROOM_AIR_FIO2 = 0.2093;
/** Converts VCO2 (mL/min STPD) over VA (mL/min BTPS) to a partial pressure in mmHg. */
export const ALVEOLAR_CONSTANT_MMHG = 863;

/** Inspired PO2: PIO2 = (PB − 47) × FIO2. Example: PB 760, FIO2 0.2093 → 149.2 mmHg. */
export function inspiredPo2Mmhg(barometricMmhg: number, fio2: number = ROOM_AIR_FIO2): number {
  return (barometricMmhg - WATER_VAPOUR_MMHG) * fio2;
}

/**
 * Alveolar PCO2 from the alveolar ventilation equation: PACO2 = 863 × VCO2 / VA,
 * VCO2 and VA in the same volume unit per minute. Example: VCO2 1.0 L/min, VA 30 L/min →
 * 28.8 mmHg.
 */
export function alveolarPco2Mmhg(vco2LMin: number, vaLMin: number): number {
  return (ALVEOLAR_CONSTANT_MMHG * vco2LMin) / vaLMin;
}

/** Alveolar ventilation VA = VE × (1 − VD/VT), L/min BTPS. */
export function alveolarVentilationLMin(veLMin: number, deadSpaceFraction: number): number {
  return veLMin * (1 - deadSpaceFraction);
}

/**
 * Alveolar PO2 from the alveolar gas equation (full form):
 * PAO2 = PIO2 − PACO2 × (FIO2 + (1 − FIO2) / R).
 * Example: PIO2 149.2, PACO2 40, R 0.8, FIO2 0.2093 → 101.3 mmHg.
 */
export function alveolarPo2Mmhg(pio2Mmhg: number, paco2Mmhg: number, rer: number, fio2: number = ROOM_AIR_FIO2): number {
  return pio2Mmhg - paco2Mmhg * (fio2 + (1 - fio2) / rer);
}

/**
 * VCO2 as a continuous broken line of VO2 (the gas-exchange threshold model behind the
 * V-slope method, Beaver et al. 1986):
 *   VCO2 = RERrest × VO2rest + s1 × (VO2 − VO2rest)                       for VO2 ≤ VT1
 *   VCO2 = RERrest × VO2rest + s1 × (VT1 − VO2rest) + s2 × (VO2 − VT1)    for VO2 > VT1
 */
export interface Vco2Line {
  readonly vo2RestMlMin: number;
  readonly rerRest: number;
  readonly vt1Vo2MlMin: number;
  readonly slopeBelowVt1: number;
  readonly slopeAboveVt1: number;
}

export function vco2FromVo2MlMin(vo2MlMin: number, line: Vco2Line): number {
  const atRest = line.rerRest * line.vo2RestMlMin;
  if (vo2MlMin <= line.vt1Vo2MlMin) return atRest + line.slopeBelowVt1 * (vo2MlMin - line.vo2RestMlMin);
  const atVt1 = atRest + line.slopeBelowVt1 * (line.vt1Vo2MlMin - line.vo2RestMlMin);
  return atVt1 + line.slopeAboveVt1 * (vo2MlMin - line.vt1Vo2MlMin);
}

/**
 * VE as a continuous broken line of VCO2 (isocapnic buffering below VT2, respiratory
 * compensation above it; Wasserman et al. 1973, common practice):
 *   VE = a + k1 × VCO2                                  for VCO2 ≤ VCO2 at VT2
 *   VE = a + k1 × VCO2(VT2) + k2 × (VCO2 − VCO2(VT2))   above, with k2 > k1
 * VE in L/min, VCO2 in L/min. With a small positive intercept a, VE/VCO2 falls a little
 * from rest and stays nearly flat (≈ k1) between VT1 and VT2, then rises above VT2.
 */
export interface VeLine {
  readonly interceptLMin: number;
  readonly slopeBelowVt2: number;
  readonly slopeAboveVt2: number;
  readonly vt2Vco2MlMin: number;
}

export function veFromVco2LMin(vco2MlMin: number, line: VeLine): number {
  const vco2L = vco2MlMin / 1000;
  const vt2L = line.vt2Vco2MlMin / 1000;
  if (vco2L <= vt2L) return line.interceptLMin + line.slopeBelowVt2 * vco2L;
  return line.interceptLMin + line.slopeBelowVt2 * vt2L + line.slopeAboveVt2 * (vco2L - vt2L);
}

/**
 * Physiological dead-space fraction VD/VT falling with exercise intensity (textbook: from
 * ≈ 0.3 at rest toward ≈ 0.15 at peak, memory; the straight-line shape is assumed):
 *   VD/VT = rest − (rest − peak) × f,  f = (VO2 − VO2rest)/(VO2peak − VO2rest) clamped to [0, 1].
 */
export function deadSpaceFraction(vo2MlMin: number, vo2RestMlMin: number, vo2PeakMlMin: number, atRest: number, atPeak: number): number {
  const f = Math.min(1, Math.max(0, (vo2MlMin - vo2RestMlMin) / (vo2PeakMlMin - vo2RestMlMin)));
  return atRest - (atRest - atPeak) * f;
}

/** Age-predicted maximal heart rate, 208 − 0.7 × age (Tanaka et al., JACC 2001). Age 40 → 180 bpm. */
export function tanakaHrMaxBpm(ageY: number): number {
  return 208 - 0.7 * ageY;
}

/** HR linear in VO2 from resting HR at resting VO2 to peak HR at peak VO2 (common practice). */
export function hrFromVo2Bpm(vo2MlMin: number, vo2RestMlMin: number, vo2PeakMlMin: number, hrRestBpm: number, hrPeakBpm: number): number {
  return hrRestBpm + ((hrPeakBpm - hrRestBpm) * (vo2MlMin - vo2RestMlMin)) / (vo2PeakMlMin - vo2RestMlMin);
}

/**
 * Tidal volume saturating with ventilation (tidal volume grows first, then breathing rate
 * carries the rise; shape assumed, common practice):
 *   VT = VTmax − (VTmax − VTrest) × exp(−(VE − VErest) / scale),  VT in L, VE and scale in L/min.
 * Breathing rate is then VE / VT.
 */
export function tidalVolumeL(veLMin: number, veRestLMin: number, vtRestL: number, vtMaxL: number, scaleLMin: number): number {
  return vtMaxL - (vtMaxL - vtRestL) * Math.exp(-Math.max(0, veLMin - veRestLMin) / scaleLMin);
}

/**
 * Steady-state O2 cost of walking, ACSM metabolic equation (memory):
 * VO2 (mL/kg/min) = 0.1 × speed (m/min) + 1.8 × speed (m/min) × grade (fraction) + 3.5.
 * Example: 4.8 km/h (80 m/min), 10 % → 8 + 14.4 + 3.5 = 25.9 mL/kg/min.
 */
export function walkingVo2MlKgMin(speedKmh: number, gradePct: number): number {
  const mPerMin = (speedKmh * 1000) / 60;
  return 0.1 * mPerMin + 1.8 * mPerMin * (gradePct / 100) + 3.5;
}

/**
 * Steady-state VO2 of cycling: resting VO2 + unloaded-pedalling cost + gain × work.
 * Gain ≈ 10 mL/min/W in healthy adults (memory; ATS/ACCP 2003).
 */
export function cyclingVo2MlMin(workW: number, vo2RestMlMin: number, unloadedCostMlMin: number, gainMlMinW: number): number {
  return vo2RestMlMin + unloadedCostMlMin + gainMlMinW * workW;
}
