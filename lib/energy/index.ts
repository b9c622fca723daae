// Public API of the pure energy model (no I/O, SI units).
export * from './types';
export { modelBank, energyJoules, usableJoules, stateOfCharge, shortCircuitAmps, voltsForJoules } from './bank';
export { efficiencyAt, efficiencyBreakVolts, inputCurrentAmps, sortEfficiencyTable, type Efficiency } from './efficiency';
export { averageOutputWatts, bankWatts, bankWattsCurve } from './load';
export { checkBurst, burstCompletes, solveBurstFloor, burstFloorVolts, reserveJoules, type BurstCheck, type BurstFloor } from './burst';
export { buildDischargeTable, secondsAtVolts, voltsAtSeconds, traceDischarge, type DischargeTable } from './discharge';
export {
  apparentFromTrueDeg,
  dischargeWindow,
  type DischargeWindow,
  findSunCrossing,
  isSunBelow,
  nextRechargeAt,
  nextSunsetAt,
  nightWindows,
  SEARCH_LIMIT_SECONDS,
  type SunDirection,
} from './sun';
export { nightAfter, longestNight, type Night } from './nights';
export { marginOverWindow, nightMargin, type MarginResult } from './margin';
export { stateFromMargin } from './state';
export { nextReportSeconds } from './cadence';
export { drawScaleFrom, evaluateNode, PROJECT_WITH_MEASURED_ABOVE, type NodeInput, type NodeEvaluation } from './evaluate';
export {
  fitEnergySlope,
  harvestWatts,
  measuredVsModelled,
  selectNoChargeSamples,
  selectChargingSamples,
  type EnergySlopeFit,
  type VoltageSample,
} from './measured-draw';
export {
  characterizeDischarge,
  batchFlags,
  EnergyInputError,
  NeverCrossesError,
  V1_FRACTION,
  V2_FRACTION,
  type Characterization,
  type CellMeasurement,
  type CellFlags,
} from './characterize';
export { planBank, bankSpec, burstLimit, type PlanInput, type BankPlan, type BurstBlocked, type CellSpec } from './sizing';
export { checkNodeSpecs, type FieldProblem } from './validate';
