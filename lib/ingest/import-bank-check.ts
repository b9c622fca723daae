import { formatVolts } from '../format/units';
import { calibratedVolts, type NodeRow } from '../status/node-spec';

/**
 * An imported line's bank volts against the node's bank (ns·Vr). Only the import refuses such
 * lines: a device post is still stored and raises the over-voltage caution and alert, since a
 * live bank above its rating is a hazard to see, not to drop. A file is different: values far
 * above the rating are nearly always the wrong column, millivolts, or another node's log.
 *
 * 10 % over the rating: a supercap bank is never charged above its rated voltage (common
 * practice); makers allow a short surge a few per cent above it, and a logger's divider and
 * ADC add a per cent or two. Past 10 % the figure is beyond any of that.
 */
export const IMPORT_OVER_RATING_FRACTION = 0.1;

export type ImportBank = Pick<NodeRow, 'cells_series' | 'cell_rated_volts' | 'cal_gain' | 'cal_offset_volts'>;

/** Why this line's v cannot be this node's bank, in words with volts; null when it can. */
export function bankVoltsProblem({ bank, reportedVolts }: { bank: ImportBank; reportedVolts: number }): string | null {
  const volts = calibratedVolts(bank, reportedVolts);
  const calibrated = volts !== reportedVolts;
  const figure = calibrated ? `${formatVolts(reportedVolts, 2)} (${formatVolts(volts, 2)} after this node's calibration)` : formatVolts(volts, 2);
  if (volts < 0) return `v: ${figure} is below 0 V; a bank cannot hold negative volts. Check the probe polarity and the column.`;
  const ratedVolts = bank.cells_series * bank.cell_rated_volts;
  if (volts > ratedVolts * (1 + IMPORT_OVER_RATING_FRACTION)) {
    return `v: ${figure} is more than ${Math.round(IMPORT_OVER_RATING_FRACTION * 100)} % above the bank's rating of ${formatVolts(ratedVolts, 2)} `
      + `(${bank.cells_series} × ${formatVolts(bank.cell_rated_volts, 2)} cells). Check the column, the unit (volts, not millivolts) and the node.`;
  }
  return null;
}
