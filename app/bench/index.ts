export { randomEffects, hksjInterval, HKSJ_BELOW, type Study, type RandomEffects } from "./across-rigs";
export { rigAgreement, type RigReading, type RigBias, type RigAgreement } from "./agreement";
export { pressureSlope, type PressurePoint, type PressureSlope, type BandPoint } from "./pressure-slope";
export { forceForJob, forceForJobGrouped, chanceAtForce, forceCurve } from "./force-for-job";
export type { ForceRow, ForceGroup, ForceFit, ForceOptions } from "./force-for-job";
// Bench runs' pure computation: calibration fits, the check-standard chart, trace analysis, figures.
export { fitCalibration, readingToReference, calibrationStatus } from "./calibration";
export type { CalibrationFit, CalibrationPoint, CalibrationState } from "./calibration";
export { CALIBRATION_MAX_AGE_MONTHS, QUADRATIC_SIGNIFICANCE } from "./calibration";
export { individualsChart } from "./control-chart";
export type { IndividualsChart } from "./control-chart";
export { parseTraceCsv, TraceError, analyseTrace, decimateForDrawing, synthesizeTrace } from "./trace";
export type { ParseTraceOptions, SynthesizeTraceOptions, TraceAnalysis, TraceBlow, AnalyseTraceOptions } from "./trace";
export { meanInterval, seriesFigures, triggerControlRange, blowRateAgreement, peakSummary } from "./figures";
export type { PeakSummary } from "./figures";
export { BLOW_RATE_TOLERANCE } from "./figures";
export { mulberry32 } from "~/utils/random";
