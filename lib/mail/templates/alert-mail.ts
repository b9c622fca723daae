import { KIND_INFO, DRAW_ANOMALY_RATIO, overVoltageWords, type AlertKind } from '../../alerts/kinds';
import type { AlertDetail } from '../../alerts/rules';
import { stateOfCharge } from '../../energy';
import { formatPercent } from '../../format/units';
import { escapeHtml, oneLine } from '../outbox';
import { formatMargin, formatMilliwatts, htmlList, htmlRows, localTime, nodeLink, textRows } from './parts';

/**
 * The e-mail of one alert: what is wrong, when it bites in the site's own time, the likely
 * cause from measured vs modelled draw, what to do, and a link to the node page. Names come
 * from users: the subject is flattened to one line and the HTML escapes every value.
 */
export interface AlertMailInput {
  kind: AlertKind;
  detail: AlertDetail;
  nodeId: number;
  nodeName: string;
  siteName: string;
  timeZone: string;
  appUrl: string;
  reminder?: boolean;
  /** The converter's cutoff: the state of charge is the share of energy between it and full. */
  cutoffVolts?: number | null;
}

export function buildAlertMail(input: AlertMailInput): { subject: string; text: string; html: string } {
  const { detail, timeZone } = input;
  const info = KIND_INFO[input.kind];
  const brownout = localTime(detail.brownout_at, timeZone);
  // A short node whose projected brownout lies before this pass has gone quiet since: say so.
  const brownoutPassed = detail.brownout_at !== null && Date.parse(detail.brownout_at) <= Date.parse(detail.evaluated_at);
  const recharge = localTime(detail.recharge_at, timeZone);
  const headline = subjectTail(input, brownout, brownoutPassed);
  const subject = oneLine(`${input.reminder ? 'Reminder: ' : ''}${input.nodeName} at ${input.siteName} is ${headline}`);
  const rows: [string, string][] = [
    ['Node', oneLine(input.nodeName)],
    ['Site', oneLine(input.siteName)],
    ['State', detail.state],
    ['Night margin', formatMargin(detail.margin)],
    ['Bank', bankWords(detail, input.cutoffVolts)],
    ['Projected brownout', brownout ? `${brownout}${brownoutPassed ? ' (passed, no report since)' : ''}` : 'none before recharge'],
    ['Recharge', recharge ?? 'not within 7 days'],
    ['Last reading', localTime(detail.last_reading_at, timeZone) ?? 'none'],
  ];
  // The draw explains a reserve, not a bank above its rating.
  const cause = causeOf(input.kind, detail, timeZone);
  const link = nodeLink(input.appUrl, input.nodeId);
  const intro = `${oneLine(input.nodeName)} — ${info.title}.`;
  const text = [
    intro,
    '',
    textRows(rows),
    '',
    `Likely cause: ${cause}`,
    '',
    'What to do:',
    ...info.todo.map((t) => `- ${t}`),
    '',
    `Node page: ${link}`,
    '',
    `Times are in the site's zone (${timeZone}).${input.reminder ? ' This alert is not acknowledged yet; acknowledge it on the alerts page to stop reminders.' : ''}`,
  ].join('\n');
  const html = [
    `<p><strong>${escapeHtml(intro)}</strong></p>`,
    htmlRows(rows),
    `<p><strong>Likely cause:</strong> ${escapeHtml(cause)}</p>`,
    `<p><strong>What to do:</strong></p>`,
    htmlList(info.todo),
    `<p><a href="${escapeHtml(link)}">Open the node page</a></p>`,
    `<p style="color:#666">Times are in the site's zone (${escapeHtml(timeZone)}).</p>`,
  ].join('\n');
  return { subject, text, html };
}

/**
 * "4.61 V, state of charge 73 % (of the energy above the 0.50 V cutoff)": the figure and the words
 * of the node page, never a share of volts. Above the rating the state of charge stops at
 * 100 % and the rating is said beside it.
 */
function bankWords(detail: AlertDetail, cutoffVolts: number | null | undefined): string {
  if (typeof detail.volts !== 'number') return 'no reading';
  const volts = `${detail.volts.toFixed(2)} V`;
  const over = detail.volts > detail.max_volts ? `, over the rated ${detail.max_volts.toFixed(2)} V` : '';
  if (typeof cutoffVolts !== 'number' || !Number.isFinite(cutoffVolts)) return `${volts}${over || ` (rated ${detail.max_volts.toFixed(2)} V)`}`;
  const soc = stateOfCharge({ volts: detail.volts, cutoffVolts, maxVolts: detail.max_volts });
  return `${volts}, state of charge ${formatPercent(soc)} (of the energy above the ${cutoffVolts.toFixed(2)} V cutoff)${over}`;
}

/** Why, in one sentence: the draw explains a reserve; a quiet node or a bank over its rating has other causes. */
function causeOf(kind: AlertKind, detail: AlertDetail, timeZone: string): string {
  switch (kind) {
    case 'over_voltage':
      return 'a charger that does not regulate (or regulates too high), bank settings that do not match the bank (cells in series, cell rating), or a calibration that reads high.';
    case 'dark_through_day':
      return `no report through the day of ${dayWords(detail, timeZone)}: the bank is not refilling. A panel that is dirty, shaded, unplugged or broken, a charger fault, or a failed cell; a fully overcast day can also keep it down.`;
    case 'node_silent':
      return `its bank was healthy at its last report (night margin ${formatMargin(detail.margin)}), so power is not the cause: the radio link (antenna, cable, gateway, interference) or the firmware (a hang or a crash loop).`;
    case 'node_dark':
      return `its last report was at or near the burst floor, so it has most likely browned out; ${likelyCause(detail)}`;
    default:
      return likelyCause(detail);
  }
}

function subjectTail(input: AlertMailInput, brownout: string | null, brownoutPassed: boolean): string {
  const d = input.detail;
  switch (input.kind) {
    case 'reserve_short':
      if (brownoutPassed) return `short: its projected brownout at ${brownout} has passed with no report since`;
      return `short: brownout projected ${brownout ?? 'before recharge'} (margin ${formatMargin(d.margin)})`;
    case 'reserve_thin':
      return `thin (margin ${formatMargin(d.margin)})`;
    case 'node_dark':
      return 'dark: presumed browned out';
    case 'dark_through_day':
      return 'still dark after a whole day of sun: visit it';
    case 'node_silent':
      return 'silent while healthy';
    case 'draw_anomaly':
      return `drawing ${d.draw_ratio?.toFixed(1) ?? '?'}x the modelled power`;
    case 'not_charging':
      return 'not charging on a clear day';
    case 'over_voltage':
      return typeof d.volts === 'number' && d.max_volts ? `over-voltage (${overVoltageWords({ volts: d.volts, maxVolts: d.max_volts })})` : 'over-voltage';
  }
}

/** Measured vs modelled draw decides between "the node uses too much" and "the bank is too small". */
export function likelyCause(detail: AlertDetail): string {
  const measured = formatMilliwatts(detail.measured_watts);
  const modelled = formatMilliwatts(detail.modelled_watts);
  if (!measured || !modelled || detail.draw_ratio === null) {
    return 'no measured draw yet (it needs a night of readings); the projection uses the modelled load.';
  }
  const figures = `last night it drew ${measured} against ${modelled} modelled (${detail.draw_ratio.toFixed(2)}x)`;
  if (detail.draw_ratio > DRAW_ANOMALY_RATIO) {
    return `${figures}: far more than the load profile explains, so look for firmware stuck awake, a leak or lost capacitance.`;
  }
  return `${figures}: the draw matches the model, so the bank is too small for this night at this cadence, or the panel did not refill it.`;
}

/** "Thu 3 Dec 07:58 – 15:46": the day a dark node missed, in the site's zone. */
function dayWords(detail: AlertDetail, timeZone: string): string {
  const from = localTime(detail.missed_day_start_at, timeZone);
  const to = localTime(detail.missed_day_end_at, timeZone);
  return from && to ? `${from} to ${to}` : 'the last whole day';
}
