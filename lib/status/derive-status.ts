import { evaluateNode, type StateThresholds } from '../energy';
import type { NodeState } from '../config/node-states';
import type { NodeModelSpec } from './node-spec';

/**
 * A node's latest status from its latest reading. The margin states come from the energy
 * model; `dark`, `silent` and `new` come from the reading history: a node quiet for more than
 * three report intervals is `dark` when it went quiet at or near its burst floor, after its
 * projected brownout or while projected short, otherwise `silent`. A node whose projected brownout has passed is
 * `dark` sooner, as soon as it has missed a report since: left `short`, it would keep telling
 * the deployer about a brownout in the past tense it cannot have.
 */
export const QUIET_INTERVALS = 3;
/** Past its projected brownout, quiet for this many expected intervals is a missed report. */
export const MISSED_REPORT_INTERVALS = 1.5;
// "Near the floor": within this fraction of the span from the floor to full.
export const NEAR_FLOOR_FRACTION = 0.1;

export interface LatestReading {
  t: Date;
  volts: number; // calibrated
  panelVolts: number | null;
}

export interface DerivedStatus {
  state: NodeState;
  last_reading_at: Date | null;
  volts: number | null;
  panel_volts: number | null;
  energy_joules: number | null;
  soc: number | null;
  burst_floor_volts: number | null;
  reserve_joules: number | null;
  margin: number | null;
  load_watts: number | null;
  recharge_at: Date | null;
  brownout_at: Date | null;
  next_report_s: number | null;
  evaluated_at: Date;
}

export function deriveNodeStatus(opts: {
  spec: NodeModelSpec;
  latest: LatestReading | null;
  now: Date;
  thresholds: StateThresholds;
  lastAdvisedIntervalSeconds?: number | null;
  /** Measured ÷ modelled draw to project with (drawScaleFrom); 1 when absent. */
  drawScale?: number;
}): DerivedStatus {
  const { spec, latest, now } = opts;
  if (!latest) {
    return {
      state: 'new', last_reading_at: null, volts: null, panel_volts: null, energy_joules: null, soc: null, burst_floor_volts: null,
      reserve_joules: null, margin: null, load_watts: null, recharge_at: null, brownout_at: null, next_report_s: null, evaluated_at: now,
    };
  }
  const e = evaluateNode({ ...spec, volts: latest.volts, at: latest.t, thresholds: opts.thresholds, drawScale: opts.drawScale });
  const expectedInterval = Math.max(spec.load.intervalSeconds, opts.lastAdvisedIntervalSeconds ?? 0, e.nextReportSeconds);
  const quietSeconds = (now.getTime() - latest.t.getTime()) / 1000;
  let state: NodeState = e.state;
  const brownedOutByNow = e.brownoutAt !== null && e.brownoutAt.getTime() <= now.getTime();
  if (brownedOutByNow && quietSeconds > MISSED_REPORT_INTERVALS * expectedInterval) {
    state = 'dark';
  } else if (quietSeconds > QUIET_INTERVALS * expectedInterval) {
    const maxVolts = spec.bank.cellsSeries * spec.bank.cellRatedVolts;
    const nearFloor = latest.volts <= e.burstFloorVolts + NEAR_FLOOR_FRACTION * (maxVolts - e.burstFloorVolts);
    // A node already projected short is not "healthy" when it goes quiet: presumed browned out.
    state = nearFloor || brownedOutByNow || e.state === 'short' ? 'dark' : 'silent';
  }
  return {
    state,
    last_reading_at: latest.t,
    volts: latest.volts,
    panel_volts: latest.panelVolts,
    energy_joules: e.energyJoules,
    soc: e.soc,
    burst_floor_volts: e.burstFloorVolts,
    reserve_joules: e.reserveJoules,
    margin: Number.isFinite(e.margin) ? e.margin : null,
    load_watts: e.loadWatts,
    recharge_at: e.rechargeAt,
    brownout_at: e.brownoutAt,
    next_report_s: e.nextReportSeconds,
    evaluated_at: now,
  };
}
