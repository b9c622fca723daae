import { modelBank } from './bank';
import { reserveJoules, solveBurstFloor } from './burst';
import { buildDischargeTable, secondsAtVolts, voltsAtSeconds } from './discharge';
import { efficiencyBreakVolts } from './efficiency';
import { averageOutputWatts, bankWattsCurve } from './load';
import { nextRechargeAt, SEARCH_LIMIT_SECONDS } from './sun';
import type { BankModel, BankSpec, ConverterSpec, LoadSpec, SiteSpec } from './types';

export interface MarginResult {
  reserveJoules: number;
  drawJoules: number;
  rechargeAt: Date | null;
  /** reserve ÷ draw to recharge; Infinity when nothing is drawn and something is in reserve. */
  margin: number;
  brownoutAt: Date | null;
}

/**
 * Margin of a bank at `volts` over `windowSeconds` of discharge.
 * Draw is the bank-side energy taken during the window: while the bank stays above the burst
 * floor that is exactly the fall in stored energy, ½C(V0² − V(T)²). If the floor is reached
 * first (brownout), the draw counts the reserve plus the bank-side power at the floor voltage
 * for the rest of the window — what the node would still need to reach recharge — so the
 * margin falls below 1 exactly when a brownout is projected.
 */
export function marginOverWindow({
  bank,
  converter,
  load,
  volts,
  windowSeconds,
  floorVolts,
  intervalSeconds = load.intervalSeconds,
  drawScale = 1,
}: {
  bank: BankModel;
  converter: ConverterSpec;
  load: LoadSpec;
  volts: number;
  windowSeconds: number;
  floorVolts: number;
  intervalSeconds?: number;
  /** The measured ÷ modelled draw to project with (1: the load profile as it stands). */
  drawScale?: number;
}): { reserveJoules: number; drawJoules: number; margin: number; brownoutSeconds: number | null } {
  const outputWatts = averageOutputWatts({ load, outputVolts: converter.outputVolts, intervalSeconds });
  const bankWattsAt = bankWattsCurve({ outputWatts, efficiency: converter.efficiency, leakageAmps: bank.leakageAmps, scale: drawScale });
  const reserve = reserveJoules({ farads: bank.farads, volts, burstFloorVolts: floorVolts });
  if (reserve <= 0) {
    const drawJoules = Math.max(0, bankWattsAt(floorVolts)) * windowSeconds;
    return { reserveJoules: 0, drawJoules, margin: 0, brownoutSeconds: 0 };
  }
  const table = buildDischargeTable({
    farads: bank.farads,
    fromVolts: volts,
    downToVolts: floorVolts,
    bankWattsAt,
    breakVolts: efficiencyBreakVolts({ efficiency: converter.efficiency }),
  });
  const floorSeconds = secondsAtVolts({ table, volts: floorVolts });
  let drawJoules: number;
  let brownoutSeconds: number | null = null;
  if (floorSeconds > windowSeconds) {
    const endVolts = voltsAtSeconds({ table, seconds: windowSeconds }) ?? floorVolts;
    drawJoules = 0.5 * bank.farads * (volts * volts - endVolts * endVolts);
  } else {
    brownoutSeconds = floorSeconds;
    drawJoules = reserve + bankWattsAt(floorVolts) * (windowSeconds - floorSeconds);
  }
  const margin = drawJoules > 0 ? reserve / drawJoules : Number.POSITIVE_INFINITY;
  return { reserveJoules: reserve, drawJoules, margin, brownoutSeconds };
}

/** Night margin of a node now: reserve ÷ bank-side energy drawn until the next recharge (7 days at most). */
export function nightMargin({
  bank,
  converter,
  load,
  site,
  volts,
  at,
  rechargeAt = nextRechargeAt({ site, at }),
  floorVolts,
  drawScale = 1,
}: {
  bank: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  site: SiteSpec;
  volts: number;
  at: Date;
  /** Pass a precomputed recharge instant (or null) to skip the sun search. */
  rechargeAt?: Date | null;
  floorVolts?: number;
  /** The bank-side draw as a multiple of the load profile's (drawScaleFrom); 1 is the plain model. */
  drawScale?: number;
}): MarginResult {
  const model = modelBank({ bank });
  const floor = floorVolts ?? solveBurstFloor({ bank: model, converter, load }).volts;
  const windowSeconds = rechargeAt ? (rechargeAt.getTime() - at.getTime()) / 1000 : SEARCH_LIMIT_SECONDS;
  const result = marginOverWindow({ bank: model, converter, load, volts, windowSeconds, floorVolts: floor, drawScale });
  return {
    reserveJoules: result.reserveJoules,
    drawJoules: result.drawJoules,
    rechargeAt,
    margin: result.margin,
    brownoutAt: result.brownoutSeconds === null ? null : new Date(at.getTime() + result.brownoutSeconds * 1000),
  };
}
