import type { Knex } from 'knex';

/**
 * node_status keeps, beside the draw measured over the latest night, the draw the load profile
 * predicts for that same night (at its voltages and the cadence the node really ran). The fleet
 * divided the night's measured draw by the draw modelled at the latest reading instead, so its
 * ratio and its "model" figure disagreed with the node page and the alerts for the same node.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('node_status', (t) => {
    t.double('modelled_watts').nullable().after('measured_watts');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('node_status', (t) => {
    t.dropColumn('modelled_watts');
  });
}
