// The statistics module's public face: plain functions, no framework or database imports.
export { wilsonInterval, differenceInterval, probabilityGreater, shrinkProportions, type Interval, type Group } from "./proportions";
export { meanInterval, meanIntervalFromSummary, bootstrapInterval, bootstrapMedianInterval, median, correlation } from "./continuous";
export { logisticFit, logisticPredict, type LogisticFit } from "./logistic";
export { zCritical, tCritical } from "./distributions";
