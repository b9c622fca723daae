import {
  averageOutputWatts, bankWattsCurve, buildDischargeTable, efficiencyBreakVolts, energyJoules, modelBank, nextRechargeAt,
  reserveJoules, SEARCH_LIMIT_SECONDS, solveBurstFloor, traceDischarge, type BankSpec, type ConverterSpec, type LoadSpec, type SiteSpec,
} from '../energy';
import type { ProjectionWire } from './wire';

/**
 * The projection drawn as the curve's continuation: the model's discharge from the latest
 * reading, at the configured cadence, until the next recharge (sun up through the site's
 * recharge elevation) or until the bank reaches the burst floor, whichever comes first — the
 * same discharge the night margin is computed from (lib/energy/margin.ts).
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
  const rechargeAt = nextRechargeAt({ site: spec.site, at });
  const windowSeconds = rechargeAt ? (rechargeAt.getTime() - at.getTime()) / 1000 : SEARCH_LIMIT_SECONDS;
  const atSeconds = at.getTime() / 1000;
  const rechargeSeconds = rechargeAt ? rechargeAt.getTime() / 1000 : null;
  const { points, floorSeconds } = volts > floorVolts
    ? traceToFloor({ spec, farads: bank.farads, leakageAmps: bank.leakageAmps, volts, floorVolts, windowSeconds, steps, drawScale })
    : { points: [{ t: 0, volts }], floorSeconds: 0 };
  // Browned out: the bank reaches the floor within the window (as marginOverWindow decides it).
  const brownout = floorSeconds <= windowSeconds;
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
