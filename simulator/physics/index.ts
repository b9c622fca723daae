// Public surface of the simulator's physics (independent of lib/energy on purpose: it checks it).
export * from './types';
export { SimNode, type SimNodeOptions, type SimStepResult } from './node';
export { makeSimReading } from './reading';
export { simulateNode, simulateDischargeUntilBrownout, type SimulateNodeOptions, type SimulateNodeResult } from './simulate';
export { createBankPhysics, getStoredJoules, applyJoules, type BankPhysics } from './bank';
export { getEfficiency, solveTerminal } from './converter';
export { runLoadPhase, runReportCycle, findBurstFloorVolts, type PhaseResult } from './burst';
export { getSunElevationRadians, getClearSkyIrradiance, getPanelVolts, getNextSunrise } from './sun';
export { createWeather, type Weather, type SkyKind, type ForcedSpell } from './weather';
export { createRandom, hashSeed, randomAt, seedFromText } from './prng';
