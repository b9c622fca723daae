import { DEFAULT_OWNER_KINDS } from '@/lib/alerts/recipients';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { evaluateNode } from '@/lib/energy';
import { createTestOrg, readMessages, spec, startCatcher, voltsForMarginOf, type TestOrg } from './alerts-fixtures';
import {
  addNodeLike, deviceTokens, marginPassCounts, postReadings, startAppInstances, startJobRunners, waitFor, type Reading,
} from './helpers/instances';
import { appUrl } from './helpers/stack';

// Issue 9: "Several app instances and two job runners against one MariaDB give the same results as
// one (no doubled alerts or e-mails)". One scenario is played twice on twin nodes: through the
// stack's app and ONE runner (the reference), then spread over THREE app instances with TWO
// runners at once; the database and the mail catcher must end up the same, mail sent once.
// Source for what is checked: DESIGN.md §5 (at-least-once ingest, all-or-nothing batches) and §7
// (named locks, each e-mail once); exactly-once effects from at-least-once delivery is common practice.
const INTERVAL_S = 2;
const T = Date.now() - (Date.now() % 60_000);
// Runners pass at the real time, so the sites sit where it is 02:00 solar time at T: night in every
// season at 47° N and hours before recharge, so margins below 1 are reachable whenever this runs.
const hoursUtc = new Date(T).getUTCHours() + new Date(T).getUTCMinutes() / 60;
const lon = ((((2 - hoursUtc) * 15) % 360) + 540) % 360 - 180;
const model = { ...spec, site: { ...spec.site, lon } };
const floorVolts = evaluateNode({ ...model, volts: 4, at: new Date(T) }).burstFloorVolts;
const maxVolts = spec.bank.cellsSeries * spec.bank.cellRatedVolts;

type Kind = 'reserve_short' | 'node_silent' | 'node_dark';
const PLAN: { key: string; org: number; minutesAgo: number; margin?: number; state: string; kinds: Kind[] }[] = [
  { key: 'short-a', org: 0, minutesAgo: 1, margin: 0.5, state: 'short', kinds: ['reserve_short'] },
  { key: 'steady-a', org: 0, minutesAgo: 1, margin: 2.5, state: 'steady', kinds: [] },
  { key: 'silent-a', org: 0, minutesAgo: 120, margin: 2.5, state: 'silent', kinds: ['node_silent'] },
  { key: 'short-b', org: 1, minutesAgo: 2, margin: 0.7, state: 'short', kinds: ['reserve_short'] },
  { key: 'dark-b', org: 1, minutesAgo: 240, state: 'dark', kinds: ['node_dark'] }, // just above its burst floor, then quiet
  { key: 'steady-b', org: 1, minutesAgo: 2, margin: 3, state: 'steady', kinds: [] },
];
// The deployers subscribe to these; owners keep the default (DEFAULT_OWNER_KINDS).
const DEPLOYER_KINDS: Kind[] = ['reserve_short', 'node_silent', 'node_dark'];
const mailsOf = (kinds: Kind[]) => kinds.flatMap((k) => [...(DEFAULT_OWNER_KINDS.includes(k) ? [`${k}→owner`] : []), `${k}→deployer`]);
const EXPECTED_MAILS = PLAN.flatMap((p) => mailsOf(p.kinds)).length;
const ROUNDS = 6;
const PER_ROUND = 2;
const ROUND_PAUSE_MS = 800;

const READINGS: Record<string, Reading[]> = Object.fromEntries(PLAN.map((p) => {
  const last = T - p.minutesAgo * 60_000;
  const lastVolts = p.margin ? voltsForMarginOf(model, new Date(last), p.margin) : floorVolts + 0.05 * (maxVolts - floorVolts);
  // Every 3 minutes, falling slowly to the planned volts; 33 minutes in all (too short for a night-draw fit).
  return [p.key, Array.from({ length: ROUNDS * PER_ROUND }, (_, j) => {
    const back = ROUNDS * PER_ROUND - 1 - j;
    return { t: new Date(last - back * 180_000).toISOString(), v: Math.round((lastVolts + back * 0.001) * 1000) / 1000 };
  })];
}));

interface TwinSet { label: string; orgs: TestOrg[]; nodes: Record<string, { nodeId: number; token: string }> }

async function makeSet(label: string): Promise<TwinSet> {
  const set: TwinSet = { label, orgs: [], nodes: {} };
  for (const i of [0, 1]) {
    const own = PLAN.filter((p) => p.org === i);
    const org = await createTestOrg(db(), { nodeName: own[0].key });
    await db()('sites').where({ id: org.siteId }).update({ lon });
    await db()('alert_subscriptions').insert({ membership_id: org.people.deployer.membershipId, site_id: null, kinds: JSON.stringify(DEPLOYER_KINDS), delivery: 'immediate' });
    const ids = [org.nodeId];
    for (const p of own.slice(1)) ids.push(await addNodeLike(db(), org, p.key));
    const tokens = await deviceTokens(org, ids);
    own.forEach((p, k) => { set.nodes[p.key] = { nodeId: ids[k], token: tokens[k] }; });
    set.orgs.push(org);
  }
  return set;
}

/** Round r posts every node's r-th batch at once; node n's batch goes to instance (n + r) mod count,
 * and the last batch to two instances at once (or twice to the one), as a device retrying elsewhere.
 * Rounds are spaced so that margin passes fall between them, as they would in use. */
async function postScenario(set: TwinSet, urls: string[]): Promise<Record<string, Set<string>>> {
  const served: Record<string, Set<string>> = Object.fromEntries(PLAN.map((p) => [p.key, new Set<string>()]));
  for (let round = 0; round < ROUNDS; round++) {
    await Promise.all(PLAN.map(async (p, n) => {
      const batch = READINGS[p.key].slice(round * PER_ROUND, (round + 1) * PER_ROUND);
      const targets = round < ROUNDS - 1 ? [urls[(n + round) % urls.length]] : [0, 1].map((k) => urls[(n + round + k) % urls.length]);
      const replies = await Promise.all(targets.map((url) => postReadings(url, set.nodes[p.key].token, batch)));
      expect(replies.map((r) => r.status)).toEqual(targets.map(() => 200));
      // All or nothing, never stored twice (DESIGN.md §5): one copy accepted, the other all duplicates.
      expect(replies.reduce((s, r) => s + r.accepted, 0)).toBe(PER_ROUND);
      expect(replies.reduce((s, r) => s + r.duplicates, 0)).toBe(PER_ROUND * (targets.length - 1));
      for (const r of replies) served[p.key].add(r.url);
    }));
    await sleep(ROUND_PAUSE_MS);
  }
  return served;
}

/** Until every node has been passed twice after the last post and no e-mail of the set waits. */
async function settle(set: TwinSet, postedAt: number) {
  const nodeIds = Object.values(set.nodes).map((n) => n.nodeId);
  await waitFor(async () => {
    const rows = await db()('node_status').whereIn('node_id', nodeIds).select('evaluated_at');
    if (rows.some((r) => new Date(r.evaluated_at).getTime() < postedAt + 2.5 * INTERVAL_S * 1000)) return false;
    const mail = await db()('email_outbox').whereIn('org_id', set.orgs.map((o) => o.orgId)).select('status');
    return mail.length >= EXPECTED_MAILS && mail.every((m) => m.status !== 'pending');
  }, 90_000, `${set.label}: two passes after the last post and its e-mail sent`);
}

interface NodeOutcome {
  status: Record<string, unknown>;
  readings: Reading[];
  rollups: { bucket_seconds: number; n: number }[];
  alerts: { kind: string; status: string; clear_passes: number; detail: unknown }[];
  mails: string[];
  mailStates: string[];
}

/** What one set left behind, by plan key, with ids and pass times left out. */
async function outcome(set: TwinSet): Promise<Record<string, NodeOutcome>> {
  const roleOf = new Map(set.orgs.flatMap((o) => Object.entries(o.people).map(([role, p]) => [p.email, role] as const)));
  const result: Record<string, NodeOutcome> = {};
  for (const p of PLAN) {
    const { nodeId } = set.nodes[p.key];
    const { node_id: _n, org_id: _o, evaluated_at: _e, ...status } = await db()('node_status').where({ node_id: nodeId }).first();
    const readings = (await db()('readings').where({ node_id: nodeId }).orderBy('t').select('t', 'v')).map((r) => ({ t: new Date(r.t).toISOString(), v: r.v }));
    const rollups = (await db()('reading_rollups').where({ node_id: nodeId }).orderBy(['bucket_seconds', 'bucket_start'])).map(({ node_id: _id, ...r }) => r);
    const alertRows = await db()('alerts').where({ node_id: nodeId }).orderBy('kind');
    const alerts = alertRows.map((a) => {
      const { evaluated_at: _at, ...detail } = typeof a.detail === 'string' ? JSON.parse(a.detail) : a.detail;
      return { kind: a.kind, status: a.status, clear_passes: a.clear_passes, detail };
    });
    const mailRows = alertRows.length ? await db()('email_outbox').whereIn('alert_id', alertRows.map((a) => a.id)) : [];
    const mails = mailRows.map((m) => `${alertRows.find((a) => a.id === m.alert_id).kind}→${roleOf.get(m.to_address)}`).sort();
    result[p.key] = { status, readings, rollups, alerts, mails, mailStates: mailRows.map((m) => `${m.status}/${m.attempts}`) };
  }
  return result;
}

let mail: Awaited<ReturnType<typeof startCatcher>>;
let extra: Awaited<ReturnType<typeof startAppInstances>> | undefined;
const stops: (() => Promise<void>)[] = [];

beforeAll(async () => {
  mail = await startCatcher('multi-instance');
  extra = await startAppInstances(2);
  stops.push(extra.stop);
});
afterAll(async () => {
  for (const stop of stops.reverse()) await stop();
  await mail?.catcher.close();
  await closeDb();
});

describe('three app instances and two job runners against one MariaDB', () => {
  it('end the scenario exactly as one instance and one runner do: same statuses, readings and alerts, each e-mail once', async () => {
    // The reference runner starts first: its passes over the twins' nodes, still without readings, change nothing.
    const one = startJobRunners(['runner-ref'], { smtpPort: mail.port, intervalSeconds: INTERVAL_S });
    stops.push(one.stop);
    const reference = await makeSet('one instance, one runner');
    const multi = await makeSet('three instances, two runners');
    await one.ready();
    await postScenario(reference, [appUrl()]);
    await settle(reference, Date.now());
    await one.stop();

    const two = startJobRunners(['runner-a', 'runner-b'], { smtpPort: mail.port, intervalSeconds: INTERVAL_S });
    stops.push(two.stop);
    await two.ready();
    const served = await postScenario(multi, [appUrl(), ...extra!.urls]);
    for (const p of PLAN) expect(served[p.key].size).toBe(3); // every node's readings went through all three
    await settle(multi, Date.now());
    expect(two.runners.map((r) => r.alive())).toEqual([true, true]);
    const counts = two.runners.map(marginPassCounts);
    console.log(`[multi-instance] margin passes per runner: ${JSON.stringify(counts)}`);
    for (const c of counts) expect(c.ran + c.skipped).toBeGreaterThan(0); // both were at work
    await two.stop();

    const [want, got] = [await outcome(reference), await outcome(multi)];
    expect(got).toEqual(want);
    // Known answers from the model, so that equal cannot mean equally wrong.
    for (const p of PLAN) {
      const node = want[p.key];
      expect(node.status.state).toBe(p.state);
      if (p.margin) expect(node.status.margin).toBeCloseTo(p.margin, 2);
      expect(node.readings).toHaveLength(ROUNDS * PER_ROUND); // the duplicate post stored nothing more
      for (const bucket of [300, 3600]) {
        expect(node.rollups.filter((r) => r.bucket_seconds === bucket).reduce((s, r) => s + r.n, 0)).toBe(ROUNDS * PER_ROUND);
      }
      expect(node.alerts.map((a) => `${a.kind}:${a.status}`)).toEqual(p.kinds.map((k) => `${k}:open`).sort());
      expect(node.mails).toEqual(mailsOf(p.kinds).sort());
      expect(node.mailStates.every((s) => s === 'sent/1')).toBe(true); // sent once, no retry, no dead letter
    }

    // The catcher holds each outbox row's Message-ID exactly once, and nothing else for these people.
    const orgIds = [...reference.orgs, ...multi.orgs].map((o) => o.orgId);
    const rows = await db()('email_outbox').whereIn('org_id', orgIds).select('message_id', 'to_address', 'status');
    expect(rows).toHaveLength(2 * EXPECTED_MAILS);
    expect(rows.filter((r) => r.status === 'dead')).toEqual([]);
    const ours = new Set(rows.map((r) => r.to_address));
    const caught = readMessages(mail.dir).filter((m) => [...ours].some((a) => m.headers.includes(`To: ${a}`)));
    const ids = caught.map((m) => /^Message-ID:\s*(\S+)/im.exec(m.headers)?.[1]);
    expect(ids.sort()).toEqual(rows.map((r) => r.message_id).sort());
  }, 240_000);

  it('a batch sent to all three at once, then overlapping batches, leave each acknowledged reading stored once', async () => {
    const org = await createTestOrg(db(), { nodeName: 'burst' });
    const [token] = await deviceTokens(org, [org.nodeId]);
    const start = T - 3 * 86_400_000;
    const all = Array.from({ length: 300 }, (_, i) => ({ t: new Date(start + i * 10_000).toISOString(), v: 4 + (i % 50) / 1000 }));
    const urls = [appUrl(), ...extra!.urls];
    const first = await Promise.all(urls.map((url) => postReadings(url, token, all.slice(0, 150))));
    const batches = [all.slice(0, 150), all.slice(100, 250), all.slice(200, 300)];
    const second = await Promise.all(batches.map((batch, i) => postReadings(urls[i], token, batch)));
    const replies = [...first, ...second];
    const sizes = [150, 150, 150, ...batches.map((b) => b.length)];
    expect(replies.map((r) => r.status)).toEqual(sizes.map(() => 200));
    // Each post acknowledges every reading it carried, as new or as already stored (DESIGN.md §5) …
    expect(replies.map((r) => r.accepted + r.duplicates)).toEqual(sizes);
    // … and across all of them each reading was accepted once and stored once.
    expect(replies.reduce((s, r) => s + r.accepted, 0)).toBe(all.length);
    const stored = await db()('readings').where({ node_id: org.nodeId }).orderBy('t').select('t', 'v');
    expect(stored.map((r) => new Date(r.t).toISOString())).toEqual(all.map((r) => r.t));
    stored.forEach((r, i) => expect(r.v).toBeCloseTo(all[i].v, 5));
    const rollupCount = await db()('reading_rollups').where({ node_id: org.nodeId, bucket_seconds: 300 }).sum({ n: 'n' }).first();
    expect(Number(rollupCount?.n)).toBe(all.length); // folded into the chart buckets once each
  }, 60_000);
});
