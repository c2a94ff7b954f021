// The public face of the air supply model, second edition (issue 17): the line as segments in
// order, the operating inlet pressure, the tool's two air figures and the tank's run time.
export {
  COUPLER_THROATS,
  LINE_LOSS_K,
  RUNNING_AIR_FACTOR,
  boreOutletAbsBar,
  demandAt,
  lineOutletPressure,
  operatingPoint,
  runningAir,
  type LineResult,
  type OperatingPoint,
  type RunningAir,
  type RunningAirSource,
  type Segment,
  type SegmentPressure,
  type ToolAir,
} from "./line";
export {
  TANK_RUN_ASSUMPTIONS,
  tankRunTime,
  type CompressorSpec,
  type TankRunOptions,
  type TankRunResult,
  type TankSpec,
} from "./tank";
export { type ShopLine, shopLineSegments } from "./shop-line";
export { type AirAnalysis, type AirInput, analyseAir, supplyForInlet } from "./analysis";
