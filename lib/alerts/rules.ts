import type { DerivedStatus } from '../status/derive-status';
import type { StateThresholds } from '../energy';
import type { DayCharge, MissedDay } from './day-charge';
import {
  ALERT_KINDS, DRAW_ANOMALY_RATIO, DRAW_CLEAR_RATIO, MARGIN_CLEAR_BAND, OVER_VOLTAGE_CLEAR_FRACTION, OVER_VOLTAGE_FRACTION, type AlertKind,
} from './kinds';
import type { NightDraw } from './night-draw';

/**
 * One verdict per alert kind for one node and one pass. `active` opens (or keeps) the alert;
 * `clear` counts toward resolving it; neither (the hysteresis band, or nothing known) holds it
 * as it is and breaks a run of clear passes.
 */
export interface Verdict {
  active: boolean;
  clear: boolean;
}
export type Verdicts = Record<AlertKind, Verdict>;

export interface RuleInput {
  status: DerivedStatus;
  thresholds: StateThresholds;
  alertOnThin: boolean;
  maxVolts: number;
  night: NightDraw | null;
  day: DayCharge | null;
  /** The first whole day of sun since the last reading, when it has ended (see missedDay). */
  missedDay: MissedDay | null;
}

const REPORTING = new Set(['steady', 'thin', 'short']);
const HOLD: Verdict = { active: false, clear: false };

export function evaluateAlertRules(input: RuleInput): Verdicts {
  const { status, thresholds } = input;
  const state = status.state;
  const reporting = REPORTING.has(state);
  // A missing margin with a margin state means nothing to draw (or no recharge needed): clear.
  const marginAtLeast = (value: number) => status.margin === null || status.margin >= value;
  const verdicts: Verdicts = {
    // Once the node is dark the dark alert speaks for it: a short or thin alert about a brownout
    // that has happened is cleared, not left open beside it.
    reserve_short: { active: state === 'short', clear: state === 'dark' || (reporting && state !== 'short' && marginAtLeast(thresholds.thin + MARGIN_CLEAR_BAND)) },
    // Opened while thin, kept while thin or short, cleared once steady with room to spare.
    reserve_thin: input.alertOnThin
      ? { active: state === 'thin', clear: state === 'dark' || (state === 'steady' && marginAtLeast(thresholds.steady + MARGIN_CLEAR_BAND)) }
      : { active: false, clear: true },
    node_dark: { active: state === 'dark', clear: reporting },
    // The escalation of a dark node: a whole day of sun went by and it did not come back.
    dark_through_day: { active: state === 'dark' && input.missedDay !== null, clear: reporting },
    node_silent: { active: state === 'silent', clear: reporting },
    draw_anomaly: input.night && Number.isFinite(input.night.ratio)
      ? { active: input.night.ratio > DRAW_ANOMALY_RATIO, clear: input.night.ratio <= DRAW_CLEAR_RATIO }
      : HOLD,
    not_charging: input.day
      ? { active: input.day.clearSky && !input.day.gained && !input.day.nearFull, clear: input.day.gained || input.day.nearFull }
      : HOLD,
    over_voltage: status.volts !== null && reporting
      ? { active: status.volts > OVER_VOLTAGE_FRACTION * input.maxVolts, clear: status.volts <= OVER_VOLTAGE_CLEAR_FRACTION * input.maxVolts }
      : HOLD,
  };
  return verdicts;
}

/** What an alert row keeps as its detail: the node's figures at the pass that wrote it. */
export function alertDetail(input: RuleInput & { measuredWatts: number | null }) {
  const { status, night, day } = input;
  return {
    state: status.state,
    margin: status.margin,
    volts: status.volts,
    max_volts: input.maxVolts,
    burst_floor_volts: status.burst_floor_volts,
    reserve_joules: status.reserve_joules,
    load_watts: status.load_watts,
    measured_watts: input.measuredWatts,
    modelled_watts: night?.modelledWatts ?? null,
    draw_ratio: night && Number.isFinite(night.ratio) ? night.ratio : null,
    night_start_at: night?.startAt.toISOString() ?? null,
    day_gain_joules: day?.gainJoules ?? null,
    day_clear_sky: day?.clearSky ?? null,
    missed_day_start_at: input.missedDay?.startAt.toISOString() ?? null,
    missed_day_end_at: input.missedDay?.endAt.toISOString() ?? null,
    brownout_at: status.brownout_at?.toISOString() ?? null,
    recharge_at: status.recharge_at?.toISOString() ?? null,
    last_reading_at: status.last_reading_at?.toISOString() ?? null,
    evaluated_at: status.evaluated_at.toISOString(),
  };
}
export type AlertDetail = ReturnType<typeof alertDetail>;

export function activeKinds(verdicts: Verdicts): AlertKind[] {
  return ALERT_KINDS.filter((k) => verdicts[k].active);
}
