import { marginOverWindow } from './margin';
import { modelBank } from './bank';
import { solveBurstFloor } from './burst';
import type { BankSpec, ConverterSpec, LoadSpec } from './types';

/**
 * Report interval the node should use next: its configured one if that keeps margin ≥ 1;
 * else the smallest whole-second interval up to its maximum that does; else the maximum.
 * A longer interval spends less (wake and burst amortised over more sleep, when they draw more
 * than sleep does), so margin rises with the interval and integer bisection finds the edge.
 * A maximum at or below the configured interval leaves the configured one (never shorten).
 */
export function nextReportSeconds({
  bank,
  converter,
  load,
  volts,
  windowSeconds,
  floorVolts,
  configuredMargin,
  drawScale = 1,
}: {
  bank: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  volts: number;
  /** Seconds from now to recharge (7 days when there is none). */
  windowSeconds: number;
  /** The burst floor, if already solved (it does not depend on the interval). */
  floorVolts?: number;
  /** The margin at the configured interval, if already computed (the caller's own evaluation). */
  configuredMargin?: number;
  /** The measured ÷ modelled draw to project with (see marginOverWindow). */
  drawScale?: number;
}): number {
  const model = modelBank({ bank });
  const floor = floorVolts ?? solveBurstFloor({ bank: model, converter, load }).volts;
  const configured = Math.round(load.intervalSeconds);
  const maximum = Math.floor(load.maxIntervalSeconds);
  const holds = (intervalSeconds: number) =>
    (intervalSeconds === configured && configuredMargin !== undefined
      ? configuredMargin
      : marginOverWindow({ bank: model, converter, load, volts, windowSeconds, floorVolts: floor, intervalSeconds, drawScale }).margin) >= 1;
  if (holds(configured) || maximum <= configured) return configured;
  if (!holds(maximum)) return maximum;
  let failing = configured; // margin < 1 here
  let passing = maximum; // margin ≥ 1 here
  while (passing - failing > 1) {
    const mid = Math.floor((failing + passing) / 2);
    if (holds(mid)) passing = mid;
    else failing = mid;
  }
  return passing;
}
