import { z } from 'zod';
import { modelBank, type NodeEvaluation, type NodeInput } from '../energy';
import type { InvalidParam } from '../errors';
import {
  bankFromWire,
  bankSchema,
  converterFromWire,
  converterSchema,
  crossFieldProblems,
  loadFromWire,
  loadSchema,
  nonNegativeNumber,
  siteFromWire,
  siteModelSchema,
  upTo,
} from './model';

/**
 * POST /api/v1/model/evaluate: one node's specs, its bank volts now and the instant, in the
 * shared snake_case wire shapes of lib/schemas/model.ts.
 */
export const evaluateBody = z.object({
  bank: bankSchema,
  converter: converterSchema,
  load: loadSchema,
  site: siteModelSchema,
  volts: nonNegativeNumber('V').max(100, upTo(100, 'V')),
  at: z.iso.datetime({ offset: true, message: 'Give an RFC 3339 instant with its offset, e.g. 2026-12-21T16:00:00Z.' }),
}).strict();

export type EvaluateBody = z.infer<typeof evaluateBody>;

// A reading a little above the rated maximum is measurement noise or a calibration offset, not
// an impossible bank; far above it, the bank or the reading is wrong.
const OVER_MAX_TOLERANCE = 1.05;

export function evaluateInputFromWire(body: EvaluateBody): NodeInput {
  return {
    bank: bankFromWire(body.bank),
    converter: converterFromWire(body.converter),
    load: loadFromWire(body.load),
    site: siteFromWire(body.site),
    volts: body.volts,
    at: new Date(body.at),
  };
}

/** Relations between fields (cutoff below the bank's maximum …) and volts within reach of the bank. */
export function evaluateProblems(input: NodeInput): InvalidParam[] {
  const problems = crossFieldProblems({ bank: input.bank, converter: input.converter, load: input.load, site: input.site });
  const maxVolts = modelBank({ bank: input.bank }).maxVolts;
  if (input.volts > maxVolts * OVER_MAX_TOLERANCE) {
    problems.push({ pointer: '/volts', detail: `must not exceed the bank's maximum (${maxVolts} V) by more than 5 %` });
  }
  return problems;
}

/**
 * The model's answer on the wire. JSON has no Infinity: a margin the model calls infinite
 * (nothing drawn before recharge, something in reserve) is sent as null.
 */
export function evaluationToWire(e: NodeEvaluation) {
  return {
    energy_joules: e.energyJoules,
    usable_joules: e.usableJoules,
    soc: e.soc,
    burst_floor_volts: e.burstFloorVolts,
    reserve_joules: e.reserveJoules,
    load_watts: e.loadWatts,
    recharge_at: e.rechargeAt ? e.rechargeAt.toISOString() : null,
    charging_until: e.chargingUntil ? e.chargingUntil.toISOString() : null,
    margin: Number.isFinite(e.margin) ? e.margin : null,
    brownout_at: e.brownoutAt ? e.brownoutAt.toISOString() : null,
    state: e.state,
    next_report_s: e.nextReportSeconds,
    short_circuit_amps: Number.isFinite(e.shortCircuitAmps) ? e.shortCircuitAmps : null,
  };
}

export type EvaluationWire = ReturnType<typeof evaluationToWire>;
