import type { Knex } from 'knex';
import { ALERT_KINDS as FIRST_KINDS } from './20261201000004_alerts';

/**
 * A new alert kind, `dark_through_day`: a dark node that has not come back through a whole day
 * of sun. Going dark at night is expected of a node that browned out; missing the day after is
 * the sign that the bank is not refilling (panel, wiring, charger or cells) and someone must go.
 * Every subscription that asked for `node_dark` gets its escalation too.
 */
// Beside node_dark, whose escalation it is: the screens list kinds in this order.
export const ALERT_KINDS = ['reserve_short', 'reserve_thin', 'node_dark', 'dark_through_day', 'node_silent', 'draw_anomaly', 'not_charging', 'over_voltage'] as const;

const enumOf = (kinds: readonly string[]) => `ENUM(${kinds.map((k) => `'${k}'`).join(', ')}) NOT NULL`;

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`ALTER TABLE alerts MODIFY kind ${enumOf(ALERT_KINDS)}`);
  await knex.raw(`UPDATE alert_subscriptions SET kinds = JSON_ARRAY_APPEND(kinds, '$', 'dark_through_day')
    WHERE JSON_CONTAINS(kinds, '"node_dark"') AND NOT JSON_CONTAINS(kinds, '"dark_through_day"')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex('alerts').where({ kind: 'dark_through_day' }).delete();
  await knex.raw(`UPDATE alert_subscriptions SET kinds = JSON_REMOVE(kinds, JSON_UNQUOTE(JSON_SEARCH(kinds, 'one', 'dark_through_day')))
    WHERE JSON_CONTAINS(kinds, '"dark_through_day"')`);
  await knex.raw(`ALTER TABLE alerts MODIFY kind ${enumOf(FIRST_KINDS)}`);
}
