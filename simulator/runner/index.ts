// The simulator's programmatic surface (the CLI, the demo launcher and the tests use it).
export { startFleet, stepNodeTo, type Fleet, type FleetNode, type FleetOptions, type FleetStats } from './fleet';
export { createSimClock, type SimClock } from './clock';
export { loadDemoFleet, readJsonFile, type DemoFleetFile } from './demo-loader';
export { buildGenericNodes, buildGenericSpec } from './generic-fleet';
export { readProgress, writeProgress } from './progress';
export { buildFleetNodes } from './build-nodes';
export { parseCliArgs, HELP, type CliConfig } from './cli-options';
