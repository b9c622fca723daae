import { z } from 'zod';
import { ALERT_KINDS, ALERT_STATUSES } from '../alerts/kinds';
import { NODE_STATES } from '../config/node-states';

// Shared by the alerts page, the subscription form and their route handlers.
export const alertKindSchema = z.enum(ALERT_KINDS, { message: `Choose one of: ${ALERT_KINDS.join(', ')}.` });

/** GET /api/v1/alerts?site=&node=&kind=&status=&node_state= (all optional). */
export const alertQuery = z.object({
  site: z.coerce.number().int('Use a site id.').positive('Use a site id.').optional(),
  // Another organization's node is not an error: it simply has no alerts here (no 404 to probe ids with).
  node: z.coerce.number().int('Use a node id.').positive('Use a node id.').optional(),
  kind: alertKindSchema.optional(),
  status: z.enum(ALERT_STATUSES, { message: 'Choose open, acknowledged or resolved.' }).optional(),
  /** The node's state now (DESIGN.md §4), not the alert's. */
  node_state: z.enum(NODE_STATES, { message: `Choose one of: ${NODE_STATES.join(', ')}.` }).optional(),
}).strict();
export type AlertQuery = z.infer<typeof alertQuery>;

export const subscriptionRow = z.object({
  site_id: z.number().int().positive().nullable(), // null: every site
  kinds: z.array(alertKindSchema).max(ALERT_KINDS.length * 2),
  delivery: z.enum(['immediate', 'digest'], { message: 'Choose immediate or digest.' }),
}).strict();

/** PUT /api/v1/subscriptions: the caller's whole set, at most one row per site (and one for every site). */
export const subscriptionsBody = z.object({
  subscriptions: z.array(subscriptionRow).max(500),
}).strict().superRefine((body, ctx) => {
  const seen = new Set<string>();
  body.subscriptions.forEach((row, i) => {
    const key = String(row.site_id);
    if (seen.has(key)) ctx.addIssue({ code: 'custom', path: ['subscriptions', i, 'site_id'], message: 'One row per site.' });
    seen.add(key);
  });
});
export type SubscriptionsBody = z.infer<typeof subscriptionsBody>;
