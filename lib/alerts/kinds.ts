/**
 * Alert kinds and statuses (our own names). The list matches the `alerts.kind` enum of the
 * latest migration that sets it (20261203000007_alert_dark_through_day); a unit test keeps the two equal.
 */
export const ALERT_KINDS = ['reserve_short', 'reserve_thin', 'node_dark', 'dark_through_day', 'node_silent', 'draw_anomaly', 'not_charging', 'over_voltage'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export const ALERT_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type AlertStatus = (typeof ALERT_STATUSES)[number];

/** Resolve only after this many consecutive passes with the condition clear (hysteresis). */
export const RESOLVE_AFTER_CLEAR_PASSES = 2;
/** A margin alert clears only this far above its threshold, so a margin hovering at it does not flap. */
export const MARGIN_CLEAR_BAND = 0.1;
/** Last night's measured draw over this multiple of the modelled draw is an anomaly … */
export const DRAW_ANOMALY_RATIO = 1.3;
/** … and clears at or below this one. */
export const DRAW_CLEAR_RATIO = 1.2;
/** Bank above this fraction of ns·Vr is over-voltage; back at or below the second it clears. */
export const OVER_VOLTAGE_FRACTION = 0.98;
export const OVER_VOLTAGE_CLEAR_FRACTION = 0.96;

/** The reading as a fraction of the bank's rated maximum when it is over the alert line, else null. */
export function overVoltageFraction({ volts, maxVolts }: { volts: number | null | undefined; maxVolts: number | null | undefined }): number | null {
  if (volts == null || !maxVolts || maxVolts <= 0) return null;
  const fraction = volts / maxVolts;
  return fraction > OVER_VOLTAGE_FRACTION ? fraction : null;
}

/** "9.50 V, 176 % of its rated 5.40 V": the over-voltage figure as the screens and the e-mail say it. */
export function overVoltageWords({ volts, maxVolts }: { volts: number; maxVolts: number }): string {
  return `${volts.toFixed(2)} V, ${Math.round((100 * volts) / maxVolts)} % of its rated ${maxVolts.toFixed(2)} V`;
}

export const KIND_INFO: Record<AlertKind, { title: string; todo: string[] }> = {
  reserve_short: {
    title: 'short: projected brownout before recharge',
    todo: [
      'Stretch the report interval: the ingest reply already advises a longer one when that keeps the node up.',
      'Check and clean the panel (dirt, snow, new shade).',
      'Swap tired cells or add cells to the bank before the longest nights.',
    ],
  },
  reserve_thin: {
    title: 'thin: reaches recharge with little to spare',
    todo: ['Consider a longer report interval for the coming nights.', 'Check the panel for dirt, snow or new shade.'],
  },
  node_dark: {
    title: 'dark: went quiet at or near the burst floor',
    todo: [
      'Presumed browned out: it returns by itself once the bank climbs back to the converter start voltage.',
      'If it does not come back after a sunny day, visit it: check the panel, its wiring and the cells.',
    ],
  },
  dark_through_day: {
    title: 'still dark after a whole day of sun',
    todo: [
      'Visit it: a bank that a day of sun did not bring back to the converter start voltage is not refilling.',
      'Check the panel and its connector, the charger, and the cells (a shorted or open cell); a fully overcast day can also keep it down, so look at the weather first.',
      'Treat the bank as charged until measured: it can deliver a large current into a short. Follow the cell maker\u2019s guidance and local electrical codes.',
    ],
  },
  node_silent: {
    title: 'silent: went quiet while its bank was healthy',
    todo: ['Check the radio link: antenna and cable, gateway, interference.', 'Check the firmware: a hang or a crash loop.'],
  },
  draw_anomaly: {
    title: 'draw anomaly: last night it drew far more than modelled',
    todo: [
      'Look for firmware stuck awake (a sensor time-out loop) or a peripheral left powered.',
      'A leaking or aged cell, or lost capacitance, looks the same: bench-test the cells.',
    ],
  },
  not_charging: {
    title: 'not charging: no energy gained on a clear day',
    todo: ['Check the panel, its connector and the charger.', 'Clean the panel and look for snow, dirt or new shade.'],
  },
  over_voltage: {
    title: 'over-voltage: bank above 98 % of its maximum',
    todo: [
      'Check the charger regulation; cells held above their rated voltage age fast and can vent.',
      'Disconnect the panel if the bank keeps rising. Follow the cell maker\u2019s ratings and local electrical codes.',
    ],
  },
};
