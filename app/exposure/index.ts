// The public face of the exposure module (issue 21): a day's hand-arm vibration and noise from declared
// values and trigger time. Plain functions; no framework or database imports. Methods and sources are
// in each function's comment and in tests/unit/exposure.test.ts.
export {
  REFERENCE_DAY_HOURS,
  VIBRATION_ACTION_VALUE,
  VIBRATION_LIMIT_VALUE,
  shareOfActionValue,
  vibrationA8,
  type VibrationDay,
  type VibrationExposure,
} from "./vibration";
export {
  NIOSH_NOISE,
  OSHA_NOISE,
  nioshPermissibleHours,
  noiseDose,
  oshaPermissibleHours,
  type NoiseDay,
  type NoiseExposure,
} from "./noise";
export {
  DECLARED_SOURCE,
  IN_USE_FACTOR,
  IN_USE_SOURCE,
  VIBRATION_BASES,
  inUseValue,
  type InUseValue,
  type VibrationBasis,
} from "./in-use";
export { dayExposure, type CarriedInterval, type DayExposure, type DayItem } from "./day";
export {
  JOBS_PER_DAY,
  MAX_DAY_ROWS,
  MINUTES_PER_JOB,
  readBasis,
  readDayQuery,
  readJobsPerDay,
  type DayChoices,
  type DayQuery,
  type DayRow,
  type DayRowInput,
} from "./day-query";
export {
  bestPickChances,
  mulberry32,
  sampleDraw,
  type BestPick,
  type BestPickCandidate,
  type Criterion,
  type Draw,
} from "./best-pick";
export { dominates, nonDominated, type TradeOffCriterion, type TradeOffItem } from "./trade-offs";
