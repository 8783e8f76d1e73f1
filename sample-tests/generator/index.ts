/** The test-data generator: a stated physiological model of one CPET with known ground truth. */
export { generateTest, MODEL_VERSION, OUTLIER_EFFECTS } from './generate-test';
export type { GeneratedTest, OutlierKind, OutlierTruth, TestTruth, ThresholdTruth } from './generate-test';
export { defaultCycleParams, defaultTreadmillParams, DEFAULT_NOISE } from './params';
export type { NoiseParams, ProtocolParams, RpeParams, SubjectParams, TestParams } from './params';
export { modelTrajectory, firstTimeAtVo2, parameterProblems, valueAt } from './trajectory';
export type { Trajectory } from './trajectory';
