/**
 * Family B physiological model: the parameters of one subject and protocol, and the
 * noise-free relations between metabolic rate, gas exchange and ventilation.
 *
 * Every relation here is smooth: the extra CO2 of bicarbonate buffering and the fall of
 * alveolar PCO2 after respiratory compensation are softplus terms, so no derivative jumps.
 * Sources (first author, journal, year) or "(memory)" stand beside each constant.
 */

export type KineticProtocol =
  | {
      readonly kind: 'cycle';
      /** Ramp rate, W/min (usual 10–30 W/min; ATS/ACCP 2003, memory). */
      readonly rampWPerMin: number;
    }
  | {
      readonly kind: 'treadmill';
      /** Speed and grade at the start of the ramp (the warm-up walk), km/h and %. */
      readonly startSpeedKmh: number;
      readonly startGradePct: number;
      /** Rates of increase during the ramp, km/h per min and % per min. */
      readonly speedKmhPerMin: number;
      readonly gradePctPerMin: number;
    };

export interface KineticParams {
  readonly ageY: number;
  readonly sex: 'F' | 'M';
  readonly heightCm: number;
  readonly weightKg: number;
  readonly barometricMmhg: number;
  readonly protocol: KineticProtocol;
  /** Peak VO2 the subject reaches (the test ends when noise-free VO2 gets there), mL/min. */
  readonly vo2PeakMlMin: number;
  /** Metabolic rate (VO2) at the centre of the buffering term, mL/min (the true VT1). */
  readonly vt1Vo2MlMin: number;
  /** Metabolic rate (VO2) at the centre of the respiratory-compensation term, mL/min (the true VT2). */
  readonly vt2Vo2MlMin: number;
  /** Width of the softplus transitions, mL/min of metabolic rate. */
  readonly vt1WidthMlMin: number;
  readonly vt2WidthMlMin: number;
  /** Phase-2 time constant of VO2, s (healthy adults ~30–45 s, longer when unfit; Whipp et al., J Appl Physiol 1982; Rossiter, Compr Physiol 2011; memory). */
  readonly tauVo2S: number;
  /** Time constant of VCO2 (and of the ventilation that follows it), s: τVO2 + 10–20 s (Whipp et al. 1982; memory). */
  readonly tauVco2S: number;
  /** Transit delay from muscle to mouth before the phase-2 response, s (~10–20 s; Whipp et al. 1982, memory). */
  readonly delayS: number;
  /** ΔVO2/ΔWR on the cycle, mL/min/W (about 10, 8.5–11 normal; ATS/ACCP 2003, memory). */
  readonly gainMlMinW: number;
  /** Slope of VCO2 on VO2 below VT1 (≈ 0.95–1.0; Beaver et al., J Appl Physiol 1986, memory). */
  readonly s1: number;
  /** Slope of VCO2 on VO2 well above VT1 (> 1; Beaver et al. 1986). */
  readonly s2: number;
  /** RER at rest. */
  readonly rerRest: number;
  /** Resting and peak heart rate, bpm. */
  readonly hrRestBpm: number;
  readonly hrPeakBpm: number;
  /** Phase lengths, s. The incremental phase ends at exhaustion (simulated). */
  readonly restS: number;
  readonly warmupS: number;
  readonly recoveryS: number;
  /** Upper bound of the incremental phase, s (the simulation stops there if peak is not reached). */
  readonly maxIncrementalS: number;
  readonly noise: KineticNoise;
  /** Number of sighs, swallows and coughs placed at random breaths. */
  readonly outlierCount: number;
}

export interface KineticNoise {
  /** Scale applied to every noise term below (1 = the stated defaults). */
  readonly scale: number;
  /** SD of the breath-size factor shared by VO2, VCO2 and VE (relative). */
  readonly breathSizeSd: number;
  /** Lag-1 autocorrelation of the breath-size factor. */
  readonly breathSizeRho: number;
  /** Independent additive SD of VO2 and VCO2 per breath, mL/min. */
  readonly vo2SdMlMin: number;
  readonly vco2SdMlMin: number;
  /** Independent relative SD of VE per breath. */
  readonly veRelSd: number;
  readonly peto2SdMmhg: number;
  readonly petco2SdMmhg: number;
  readonly hrSdBpm: number;
  /** Relative SD of the breath duration. */
  readonly breathDurationSd: number;
  /** Amplitude of the slow flow-sensor drift shared by VO2, VCO2, VE (relative), and of the extra O2-analyser drift on VO2. */
  readonly flowDriftAmp: number;
  readonly o2DriftAmp: number;
}

/**
 * Default noise. At 1,500 mL/min the VO2 SD per breath is √((0.05·1500)² + 45²) ≈ 87 mL/min
 * (≈ 6 %): breath-by-breath VO2 noise of the order of 50–150 mL/min, roughly independent of
 * the metabolic rate, as described by Lamarra et al., J Appl Physiol 1987 (memory).
 */
export const DEFAULT_KINETIC_NOISE: KineticNoise = {
  scale: 1,
  breathSizeSd: 0.05,
  breathSizeRho: 0.3,
  vo2SdMlMin: 45,
  vco2SdMlMin: 40,
  veRelSd: 0.03,
  peto2SdMmhg: 1.5,
  petco2SdMmhg: 0.8,
  hrSdBpm: 1.5,
  breathDurationSd: 0.18,
  flowDriftAmp: 0.012,
  o2DriftAmp: 0.006,
};

/** Numerically safe softplus: w·ln(1 + e^(x/w)). Its two asymptotes (0 and x) cross at x = 0. */
export function softplus(x: number, w: number): number {
  const z = x / w;
  return z > 30 ? x : w * Math.log1p(Math.exp(z));
}

/** Resting VO2, mL/min: 3.5 mL/kg/min (1 MET; common practice). */
export function restVo2MlMin(p: Pick<KineticParams, 'weightKg'>): number {
  return 3.5 * p.weightKg;
}

/** VO2 of unloaded pedalling, mL/min: 5.8·kg + 151 (Wasserman et al., memory). */
export function unloadedVo2MlMin(weightKg: number): number {
  return 5.8 * weightKg + 151;
}

/**
 * Steady-state VO2 of treadmill walking, mL/min: ACSM walking equation
 * 3.5 + 0.1·v + 1.8·v·grade (v in m/min, grade as a fraction), mL/kg/min (ACSM Guidelines, memory).
 */
export function walkingVo2MlMin(weightKg: number, speedKmh: number, gradePct: number): number {
  const v = (speedKmh * 1000) / 60;
  return weightKg * (3.5 + 0.1 * v + 1.8 * v * (gradePct / 100));
}

/**
 * VCO2 (mL/min) that a metabolic rate m (VO2, mL/min) produces once kinetics have settled:
 * an aerobic line through the resting point with slope s1, plus the CO2 from bicarbonate
 * buffering, (s2 − s1)·softplus(m − VT1). Below VT1 the slope tends to s1, above it to s2;
 * the two asymptotic lines cross exactly at m = VT1 (the V-slope breakpoint of Beaver et al. 1986).
 */
export function vco2FromMetabolic(m: number, p: KineticParams): number {
  const rest = restVo2MlMin(p);
  return p.rerRest * rest + p.s1 * (m - rest) + (p.s2 - p.s1) * softplus(m - p.vt1Vo2MlMin, p.vt1WidthMlMin);
}

/** Fraction 0…1 of the way from rest to peak metabolic rate (clamped). */
function effort(m: number, p: KineticParams): number {
  const rest = restVo2MlMin(p);
  return Math.min(1, Math.max(0, (m - rest) / (p.vo2PeakMlMin - rest)));
}

/**
 * Dead-space fraction VD/VT: 0.34 at rest falling smoothly to 0.20 at peak in healthy
 * adults (textbook physiology, memory).
 */
export function deadSpaceFraction(m: number, p: KineticParams): number {
  const e = effort(m, p);
  return 0.2 + 0.14 * Math.exp(-3 * e);
}

/** Fall of PaCO2 at peak caused by respiratory compensation, mmHg (≈ 5–8 mmHg; memory). */
export const RCP_DROP_MMHG = 6;

/**
 * Alveolar PCO2 (mmHg) the ventilatory control holds at metabolic rate m: 37.5 at rest rising
 * smoothly by 3.5 mmHg towards moderate exercise (isocapnic buffering keeps it there), then a
 * softplus fall after the respiratory-compensation point VT2, reaching about −RCP_DROP_MMHG at
 * peak (Wasserman et al. 1973; Whipp et al. 1989; memory). The asymptotes of the fall cross at
 * m = VT2: there PetCO2 starts to fall and VE/VCO2 starts to rise.
 */
export function alveolarPco2Mmhg(m: number, p: KineticParams): number {
  const e = effort(m, p);
  const kDrop = RCP_DROP_MMHG / Math.max(1, p.vo2PeakMlMin - p.vt2Vo2MlMin);
  return 37.5 + 3.5 * (1 - Math.exp(-4 * e)) - kDrop * softplus(m - p.vt2Vo2MlMin, p.vt2WidthMlMin);
}

/**
 * Ventilation from the alveolar ventilation equation: PACO2 = 863 × VCO2 (L/min STPD) / VA
 * (L/min BTPS), so VA = 0.863 × VCO2(mL/min) / PACO2 and VE = VA / (1 − VD/VT).
 * Worked value (check-values.md): VCO2 1.0 L/min, VA 30 L/min → 28.8 mmHg.
 */
export function ventilationLMin(vco2MlMin: number, paco2Mmhg: number, vdvt: number): number {
  return (0.863 * vco2MlMin) / paco2Mmhg / (1 - vdvt);
}

/**
 * Alveolar PO2 from the alveolar gas equation: PAO2 = PIO2 − PACO2 × (FIO2 + (1 − FIO2)/R),
 * PIO2 = (PB − 47) × 0.2093. Worked value: PB 760, PACO2 40, R 0.8 → 101.3 mmHg.
 */
export function alveolarPo2Mmhg(barometricMmhg: number, paco2Mmhg: number, rer: number): number {
  const fio2 = 0.2093;
  const pio2 = (barometricMmhg - 47) * fio2;
  return pio2 - paco2Mmhg * (fio2 + (1 - fio2) / rer);
}
