import type { Knex } from 'knex';
import { applyNodePass, type NodePassResult } from '../alerts/apply-alerts';
import type { OrgAudience } from '../alerts/notify';
import { listPassNodes } from '../db/queries/alerts';
import { listOrgContacts, listOrgSubscriptions } from '../db/queries/subscriptions';
import { MARGIN_PASS_LOCK, withNamedLock } from './named-lock';

/**
 * One margin pass: every live node evaluated from its latest readings, its status upserted and
 * its alerts opened, updated or resolved, under the named lock so that however many runners
 * there are, one pass runs at a time. Each node commits on its own: a crash mid-pass leaves
 * every node either fully before or fully after the pass, and the next pass carries on.
 * `orgIds` narrows the pass to some organizations (tests use it to stay off others' data).
 */
export interface MarginPassReport {
  ran: boolean;
  nodes: NodePassResult[];
  failures: { nodeId: number; error: string }[];
}

const PASS_CONCURRENCY = 4;

export async function runMarginPass(opts: { knex: Knex; now?: Date; appUrl: string; orgIds?: number[]; log?: (line: string) => void }): Promise<MarginPassReport> {
  const now = opts.now ?? new Date();
  const outcome = await withNamedLock({ knex: opts.knex, name: MARGIN_PASS_LOCK }, () => passAllNodes({ ...opts, now }));
  return outcome.ran ? { ran: true, ...outcome.value } : { ran: false, nodes: [], failures: [] };
}

async function passAllNodes(opts: { knex: Knex; now: Date; appUrl: string; orgIds?: number[]; log?: (line: string) => void }) {
  const audiences = new Map<number, Promise<OrgAudience>>();
  const audienceOf = (orgId: number) => {
    if (!audiences.has(orgId)) {
      audiences.set(orgId, Promise.all([listOrgContacts(opts.knex, orgId), listOrgSubscriptions(opts.knex, orgId)]).then(([members, subscriptions]) => ({ members, subscriptions })));
    }
    return audiences.get(orgId)!;
  };
  const nodes: NodePassResult[] = [];
  const failures: { nodeId: number; error: string }[] = [];
  // A few nodes at a time: each node is its own transaction, so they never step on each other,
  // and the database's round trips overlap (a pass over 1000 nodes stays within seconds).
  const queue = await listPassNodes(opts.knex, { orgIds: opts.orgIds });
  const worker = async () => {
    for (let passNode = queue.shift(); passNode; passNode = queue.shift()) {
      try {
        nodes.push(await applyNodePass({ knex: opts.knex, passNode, now: opts.now, appUrl: opts.appUrl, audienceOf }));
      } catch (error) {
        // One badly configured node must not stop the watch over the others.
        const message = error instanceof Error ? error.message : String(error);
        failures.push({ nodeId: passNode.node.id, error: message });
        opts.log?.(`[margin] node ${passNode.node.id}: ${message}`);
      }
    }
  };
  await Promise.all(Array.from({ length: PASS_CONCURRENCY }, worker));
  nodes.sort((a, b) => a.nodeId - b.nodeId);
  return { nodes, failures };
}
