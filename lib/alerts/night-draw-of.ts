import type { Knex } from 'knex';
import { readingsBetween } from '../db/queries/alerts';
import { calibratedVolts, type NodeModelSpec, type NodeRow } from '../status/node-spec';
import { measureLatestNight, type NightDraw } from './night-draw';

/** How far back the latest night is looked for: it started at most two days ago. */
export const NIGHT_HISTORY_MS = 48 * 3_600_000;

/** A node's calibrated readings of the last two days, as the night and day checks read them. */
export async function recentSamplesOf({ knex, node, now }: { knex: Knex | Knex.Transaction; node: NodeRow; now: Date }) {
  const recent = await readingsBetween(knex, node.id, new Date(now.getTime() - NIGHT_HISTORY_MS), now);
  return recent.map((r) => ({ t: r.t, volts: calibratedVolts(node, r.v), ...(r.vp === null ? {} : { panelVolts: r.vp }) }));
}

/** The latest night's measured and modelled draw for a node from the database (null: none to measure). */
export async function measureNightOf({ knex, node, spec, now }: { knex: Knex | Knex.Transaction; node: NodeRow; spec: NodeModelSpec; now: Date }): Promise<NightDraw | null> {
  return measureLatestNight({ spec, samples: await recentSamplesOf({ knex, node, now }), now });
}
