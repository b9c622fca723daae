import { nightWindows } from '../../energy';
import { bankFigures } from '../../series/bank-figures';
import { buildNightRows, lastNights } from '../../series/night-table';
import type { NightsReply } from '../../series/wire';
import { loadNodeInOrg, readSamples } from './series';

const DAY_MS = 86_400_000;
export const DEFAULT_NIGHT_COUNT = 14;

/**
 * The night-by-night table of one node: the last `count` nights that have begun (tonight
 * included while it lasts), newest first. The search starts two days further back so that the
 * oldest night is whole (nightWindows clips a night already under way at its `from`), and
 * runs a day past now so that tonight's dawn is the real one, not "now".
 */
export async function loadNightTable({ orgId, nodeId, count = DEFAULT_NIGHT_COUNT, now = new Date() }: { orgId: number; nodeId: number; count?: number; now?: Date }): Promise<NightsReply> {
  const loaded = await loadNodeInOrg({ orgId, nodeId });
  const from = new Date(now.getTime() - (count + 3) * DAY_MS);
  const windows = nightWindows({ site: loaded.spec.site, from, to: new Date(now.getTime() + DAY_MS) }).filter((w) => w.start.getTime() > from.getTime());
  // One night more than shown: the oldest row's margin needs the draw of the night before it.
  const nights = lastNights({ windows, now, count: count + 1 });
  const oldest = nights.at(-1);
  const samples = oldest ? await readSamples({ loaded, from: oldest.start, to: now }) : [];
  const bank = bankFigures({ spec: loaded.spec });
  return {
    time_unit: 's',
    node_id: nodeId,
    node_name: loaded.node.name,
    time_zone: loaded.site.time_zone,
    burst_floor_volts: bank.burst_floor_volts,
    max_volts: bank.max_volts,
    nights: buildNightRows({ spec: loaded.spec, nights, samples, now }).slice(0, count),
  };
}
