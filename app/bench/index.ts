export { randomEffects, hksjInterval, HKSJ_BELOW, type Study, type RandomEffects } from "./across-rigs";
export { rigAgreement, type RigReading, type RigBias, type RigAgreement } from "./agreement";
export { pressureSlope, type PressurePoint, type PressureSlope, type BandPoint } from "./pressure-slope";
export { forceForJob, forceForJobGrouped, chanceAtForce, forceCurve } from "./force-for-job";
export type { ForceRow, ForceGroup, ForceFit, ForceOptions } from "./force-for-job";
