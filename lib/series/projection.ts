import {
  averageOutputWatts, bankWattsCurve, buildDischargeTable, dischargeWindow, efficiencyBreakVolts, energyJoules, modelBank,
  reserveJoules, solveBurstFloor, traceDischarge, type BankSpec, type ConverterSpec, type LoadSpec, type SiteSpec,
} from '../energy';
import type { ProjectionWire } from './wire';

/**
 * The projection drawn as the curve's continuation: the model's discharge from the latest
 * reading, at the configured cadence, until the next recharge (sun up through the site's
 * recharge elevation) or until the bank reaches the burst floor, whichever comes first — the
 * same discharge the night margin is computed from (lib/energy/margin.ts). By day the curve
 * holds the present volts until dusk and falls from there (dischargeWindow).
 */
export const PROJECTION_STEPS = 120;

export function projectDischarge({
  spec,
  volts,
  at,
  steps = PROJECTION_STEPS,
  drawScale = 1,
}: {
  spec: { bank: BankSpec; converter: ConverterSpec; load: LoadSpec; site: SiteSpec };
  volts: number;
  at: Date;
  steps?: number;
  /** Measured ÷ modelled draw to project with (drawScaleFrom), as the status does. */
  drawScale?: number;
}): ProjectionWire {
  const bank = modelBank({ bank: spec.bank });
  const floorVolts = solveBurstFloor({ bank, converter: spec.converter, load: spec.load }).volts;
  const window = dischargeWindow({ site: spec.site, at });
  const { rechargeAt, delaySeconds } = window;
  const windowSeconds = window.seconds;
  const atSeconds = at.getTime() / 1000;
  const rechargeSeconds = rechargeAt ? rechargeAt.getTime() / 1000 : null;
  const traced = volts > floorVolts && windowSeconds > 0
    ? traceToFloor({ spec, farads: bank.farads, leakageAmps: bank.leakageAmps, volts, floorVolts, windowSeconds, steps, drawScale })
    : { points: [{ t: 0, volts }], floorSeconds: volts > floorVolts ? Number.POSITIVE_INFINITY : 0 };
  // By day: held at the present volts until dusk, then the night's discharge.
  const points = delaySeconds > 0 ? [{ t: 0, volts }, ...traced.points.map((p) => ({ t: p.t + delaySeconds, volts: p.volts }))] : traced.points;
  // A bank at or below the floor is there now, day or night.
  const floorSeconds = volts > floorVolts ? traced.floorSeconds + delaySeconds : 0;
  // Browned out: the bank reaches the floor within the window (as marginOverWindow decides it).
  const brownout = traced.floorSeconds <= windowSeconds;
  return {
    from_at: atSeconds,
    t: points.map((p) => Number((atSeconds + p.t).toFixed(3))),
    volts: points.map((p) => Number(p.volts.toFixed(5))),
    energy_joules: points.map((p) => Number(energyJoules({ farads: bank.farads, volts: p.volts }).toFixed(3))),
    reserve_joules: points.map((p) => Number(reserveJoules({ farads: bank.farads, volts: p.volts, burstFloorVolts: floorVolts }).toFixed(3))),
    recharge_at: rechargeSeconds,
    brownout_at: brownout ? Number((atSeconds + floorSeconds).toFixed(3)) : null,
    ends_at: brownout ? 'brownout' : 'recharge',
  };
}

function traceToFloor(opts: {
  spec: { converter: ConverterSpec; load: LoadSpec };
  farads: number;
  leakageAmps: number;
  volts: number;
  floorVolts: number;
  windowSeconds: number;
  steps: number;
  drawScale: number;
}): { points: { t: number; volts: number }[]; floorSeconds: number } {
  const { converter, load } = opts.spec;
  const outputWatts = averageOutputWatts({ load, outputVolts: converter.outputVolts });

  const table = buildDischargeTable({
    farads: opts.farads,
    fromVolts: opts.volts,
    downToVolts: opts.floorVolts,
    bankWattsAt: bankWattsCurve({ outputWatts, efficiency: converter.efficiency, leakageAmps: opts.leakageAmps, scale: opts.drawScale }),
    breakVolts: efficiencyBreakVolts({ efficiency: converter.efficiency }),
  });
  const stepSeconds = Math.max(1, opts.windowSeconds / opts.steps);
  const points = traceDischarge({ table, stepSeconds, untilSeconds: opts.windowSeconds });
  return { points, floorSeconds: table.seconds[table.seconds.length - 1] };
}
