// The statistics module's public face: plain functions, no framework or database imports.
export {
  wilsonInterval,
  wilsonAt,
  differenceInterval,
  hybridDifference,
  probabilityGreater,
  shrinkProportions,
  type Interval,
  type Group,
} from "./proportions";
export {
  meanInterval,
  meanIntervalFromSummary,
  bootstrapInterval,
  bootstrapMedianInterval,
  median,
  correlation,
} from "./continuous";
export { logisticFit, logisticPredict, type LogisticFit } from "./logistic";
export { zCritical, tCritical } from "./distributions";
export { medianInterval, type MedianInterval } from "./median";
export { kaplanMeier, type KaplanMeier, type SurvivalStep } from "./survival";
export { pooledLogisticFit, pooledPredict, type PooledLogisticFit, type PooledRow } from "./pooled-logistic";
export { clusteredWilson, distinguishable, type ClusteredInterval, type Distinguishable } from "./clustered";
