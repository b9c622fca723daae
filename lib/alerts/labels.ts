import type { NodeState } from '../config/node-states';
import { overVoltageWords, type AlertKind, type AlertStatus } from './kinds';

/**
 * Human words for the alert kinds, statuses and deliveries, as the screens say them (our own
 * wording). `state` names the node state a kind stands for, so the screens can draw that
 * state's glyph beside it; kinds that are not a state have none.
 */
export const KIND_LABELS: Record<AlertKind, { label: string; line: string; state: NodeState | null }> = {
  reserve_short: { label: 'Reserve short', line: 'Projected to brown out before the sun recharges it.', state: 'short' },
  reserve_thin: { label: 'Reserve thin', line: 'Reaches recharge, with little to spare.', state: 'thin' },
  node_dark: { label: 'Gone dark', line: 'Went quiet at or near the burst floor: presumed browned out.', state: 'dark' },
  dark_through_day: { label: 'Dark through a day', line: 'Still dark after a whole day of sun: the bank is not refilling, so someone must go.', state: 'dark' },
  node_silent: { label: 'Gone silent', line: 'Went quiet while its bank was healthy: link or firmware.', state: 'silent' },
  draw_anomaly: { label: 'Drawing too much', line: 'Last night it used far more energy than its settings predict.', state: null },
  not_charging: { label: 'Not charging', line: 'A clear day went by without the bank gaining energy.', state: null },
  over_voltage: { label: 'Over-voltage', line: 'The bank sits above 98 % of its rated maximum.', state: null },
};

export const STATUS_LABELS: Record<AlertStatus, { label: string; line: string }> = {
  open: { label: 'open', line: 'Nobody has acknowledged it yet; short alerts are re-sent until someone does.' },
  acknowledged: { label: 'acknowledged', line: 'Someone is on it; no more reminders. It resolves by itself when the condition clears.' },
  resolved: { label: 'resolved', line: 'The condition cleared on two passes in a row.' },
};

export const DELIVERY_LABELS: Record<'immediate' | 'digest', { label: string; line: string }> = {
  immediate: { label: 'Right away', line: 'One e-mail as each alert opens.' },
  digest: { label: 'Daily digest', line: 'One e-mail a day, from 07:00 site time, listing the day\u2019s alerts.' },
};

/** The alert's one line, with its own figure where the kind has one. */
export function alertLine(kind: AlertKind, detail: { volts?: number | null; max_volts?: number | null } | null): string {
  if (kind === 'over_voltage' && detail?.volts != null && detail.max_volts) {
    return `The bank read ${overVoltageWords({ volts: detail.volts, maxVolts: detail.max_volts })}. Charge above the rating is not counted in the reserve.`;
  }
  return (KIND_LABELS as Record<string, { line: string } | undefined>)[kind]?.line ?? '';
}

export function kindLabel(kind: string): string {
  return (KIND_LABELS as Record<string, { label: string } | undefined>)[kind]?.label ?? kind.replace(/_/g, ' ');
}
