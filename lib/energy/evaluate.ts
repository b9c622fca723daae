import { energyJoules, modelBank, shortCircuitAmps, stateOfCharge, usableJoules } from './bank';
import { solveBurstFloor } from './burst';
import { nextReportSeconds } from './cadence';
import { averageOutputWatts, bankWatts } from './load';
import { marginOverWindow } from './margin';
import { stateFromMargin } from './state';
import { dischargeWindow } from './sun';
import {
  DEFAULT_THRESHOLDS,
  type BankSpec,
  type ConverterSpec,
  type LoadSpec,
  type MarginState,
  type SiteSpec,
  type StateThresholds,
} from './types';

export interface NodeInput {
  bank: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  site: SiteSpec;
  /** Bank volts now. */
  volts: number;
  at: Date;
  thresholds?: StateThresholds;
  /**
   * Measured ÷ modelled draw to project the night with, when the node drew far more than its
   * settings explain (see drawScaleFrom); 1, or absent, projects with the load profile.
   */
  drawScale?: number;
}

/** The model's answer for one node, field for field the reply of POST /api/v1/model/evaluate. */
export interface NodeEvaluation {
  energyJoules: number;
  /** Above the converter cutoff. */
  usableJoules: number;
  soc: number;
  burstFloorVolts: number;
  reserveJoules: number;
  /** Bank-side average power at the given voltage, at the configured interval. */
  loadWatts: number;
  rechargeAt: Date | null;
  /** By day: the sunset from which the bank carries the load alone (the margin counts from there); null at night. */
  chargingUntil: Date | null;
  margin: number;
  brownoutAt: Date | null;
  state: MarginState;
  nextReportSeconds: number;
  shortCircuitAmps: number;
}

export function evaluateNode(input: NodeInput): NodeEvaluation {
  const { converter, load, site, volts, at } = input;
  const bank = modelBank({ bank: input.bank });
  // The floor and the recharge instant do not depend on the report interval: solve them once
  // and share them with the cadence search.
  const floorVolts = solveBurstFloor({ bank, converter, load }).volts;
  // By day the stretch to carry starts at dusk (dischargeWindow): the bank is taken as it is now.
  const window = dischargeWindow({ site, at });
  const { rechargeAt } = window;
  const windowSeconds = window.seconds;
  const startMs = window.startAt?.getTime() ?? at.getTime();
  // A reading above the bank's rated maximum (ns·Vr) is a charger fault, a wrong bank setting or
  // a bad calibration: the model credits no energy above the rating, so the reserve, the margin
  // and the brownout are never flattered by it. The energy and the short-circuit current keep
  // the reading as it is (they are cautions, and higher is the safe side).
  const creditedVolts = Math.min(volts, bank.maxVolts);
  const drawScale = input.drawScale ?? 1;
  const result = marginOverWindow({ bank, converter, load, volts: creditedVolts, windowSeconds, floorVolts, drawScale });
  const outputWatts = averageOutputWatts({ load, outputVolts: converter.outputVolts });
  return {
    energyJoules: energyJoules({ farads: bank.farads, volts }),
    usableJoules: usableJoules({ farads: bank.farads, volts: creditedVolts, floorVolts: converter.cutoffVolts }),
    soc: stateOfCharge({ volts, cutoffVolts: converter.cutoffVolts, maxVolts: bank.maxVolts }),
    burstFloorVolts: floorVolts,
    reserveJoules: result.reserveJoules,
    loadWatts: bankWatts({ outputWatts, efficiency: converter.efficiency, leakageAmps: bank.leakageAmps, volts: creditedVolts }),
    rechargeAt,
    chargingUntil: window.chargingNow ? window.startAt : null,
    margin: result.margin,
    // A bank at or below the floor is there now, day or night.
    brownoutAt: result.brownoutSeconds === null ? null : result.reserveJoules <= 0 ? at : new Date(startMs + result.brownoutSeconds * 1000),
    state: stateFromMargin({ margin: result.margin, thresholds: input.thresholds ?? DEFAULT_THRESHOLDS }),
    // The margin just computed is the one at the configured interval when that is whole seconds.
    nextReportSeconds: nextReportSeconds({
      bank: input.bank, converter, load, volts: creditedVolts, windowSeconds, floorVolts,
      configuredMargin: Number.isInteger(load.intervalSeconds) ? result.margin : undefined,
      drawScale,
    }),
    shortCircuitAmps: shortCircuitAmps({ volts, esrOhms: bank.esrOhms }),
  };
}

/** Above this measured ÷ modelled ratio the night is projected with the measured draw (the draw-anomaly line). */
export const PROJECT_WITH_MEASURED_ABOVE = 1.3;
const MAX_DRAW_SCALE = 20;

/**
 * The draw scale a node's projection uses: last night's measured ÷ modelled draw when it is
 * over 1.3 (a node stuck awake, leaking or aged cells: its settings no longer explain what it
 * draws), else 1. A smaller excess is left to the model, so a noisy fit does not move margins.
 */
export function drawScaleFrom({ measuredWatts, modelledWatts }: { measuredWatts: number | null | undefined; modelledWatts: number | null | undefined }): number {
  if (measuredWatts == null || modelledWatts == null || !(modelledWatts > 0) || !Number.isFinite(measuredWatts)) return 1;
  const ratio = measuredWatts / modelledWatts;
  return ratio > PROJECT_WITH_MEASURED_ABOVE ? Math.min(ratio, MAX_DRAW_SCALE) : 1;
}
