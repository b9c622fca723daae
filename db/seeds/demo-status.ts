import { DEFAULT_THRESHOLDS } from '../../lib/energy';
import { deriveNodeStatus, type DerivedStatus } from '../../lib/status/derive-status';
import { calibratedVolts, modelSpecFromRows, type NodeModelRow } from '../../lib/status/node-spec';
import { findDemoSite, type DemoMarginOf, type DemoNode, type DemoNodeHistory } from '../../simulator/fleet/demo-fleet';

// The product's reading of the demo nodes, used by the seed to tune the demo (and by tests).

/** A demo node's model columns as the `nodes` table stores them. */
export function demoModelRow(demo: DemoNode): NodeModelRow {
  const { bank, converter, load, calibration } = demo.config;
  return {
    cells_series: bank.cellsSeries, cells_parallel: bank.cellsParallel, cell_farads: bank.cellFarads, cell_rated_volts: bank.cellRatedVolts,
    cell_esr_ohms: bank.cellEsrOhms, cell_leakage_amps: bank.cellLeakageAmps,
    start_volts: converter.startVolts, cutoff_volts: converter.cutoffVolts, output_volts: converter.outputVolts,
    efficiency: JSON.stringify(converter.efficiency), input_limit_amps: converter.inputLimitAmps,
    sleep_amps: load.sleepAmps, awake_seconds: load.awakeSeconds, awake_amps: load.awakeAmps, burst_seconds: load.burstSeconds,
    burst_amps: load.burstAmps, interval_seconds: load.intervalSeconds, max_interval_seconds: load.maxIntervalSeconds,
    cal_gain: calibration.gain, cal_offset_volts: calibration.offsetVolts,
  };
}

/**
 * The product's own judgement of a tuned node's margin at `now` (the derivation the seed's
 * status rows get), so the cadence the simulator picks lands the node in its band as the
 * fleet page will show it, at whatever hour the demo is seeded.
 */
export const productMarginOf: DemoMarginOf = ({ node, history, now }) => {
  const status = demoNodeStatus({ node, history, now });
  if (status.state === 'dark' || status.state === 'silent' || status.state === 'new') return null;
  return status.margin ?? Infinity;
};

/** A demo node's status at `now` as the product derives it, with the default state thresholds. */
export function demoNodeStatus({ node, history, now }: { node: DemoNode; history: DemoNodeHistory; now: Date }): DerivedStatus {
  const row = demoModelRow(node);
  const site = findDemoSite(node.siteSlug);
  const last = history.readings.at(-1);
  return deriveNodeStatus({
    spec: modelSpecFromRows(row, { lat: site.latDeg, lon: site.lonDeg, recharge_elevation_deg: site.rechargeElevationDeg }),
    latest: last ? { t: last.t, volts: calibratedVolts(row, last.v), panelVolts: last.vp } : null,
    now,
    thresholds: DEFAULT_THRESHOLDS,
  });
}

