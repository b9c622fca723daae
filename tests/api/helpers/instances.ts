// More of the same product beside the test stack's own app (issue 9): extra app instances on free
// ports and job runners, all against the stack's MariaDB, each child leading its own process group
// (node runs the script with tsx as a loader), so stopping the group leaves nothing behind.
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import type { Knex } from 'knex';
import { ProcessGroup, waitForHttp } from '@/db/lifecycle/processes';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { freePort, PASSWORD, type TestOrg } from '../alerts-fixtures';
import { signedIn } from './session';

const logDir = () => path.join(currentTestProfile().dataDir, 'logs');
const TSX = ['--import', 'tsx'];

/** `count` more app instances: the same build and environment as the stack's app, other ports. */
export async function startAppInstances(count: number): Promise<{ urls: string[]; stop: () => Promise<void> }> {
  const group = new ProcessGroup(logDir());
  const started: { url: string; child: ReturnType<ProcessGroup['start']> }[] = [];
  try {
    for (let i = 0; i < count; i++) {
      const port = await freePort();
      const child = group.start(`app-extra-${i + 1}`, process.execPath, [...TSX, 'lib/server/serve.ts'], { NODE_ENV: 'production', PORT: String(port) });
      started.push({ url: `http://127.0.0.1:${port}`, child });
    }
    await Promise.all(started.map(({ url }) => waitForHttp(`${url}/`, 90_000)));
    // A port taken by someone else would answer too: the children must still be ours and alive.
    for (const { url, child } of started) if (child.exitCode !== null) throw new Error(`app instance ${url} exited early`);
  } catch (error) {
    await group.stopAll();
    throw error;
  }
  return { urls: started.map((s) => s.url), stop: () => group.stopAll() };
}

export interface RunnerHandle {
  name: string;
  output: () => string;
  alive: () => boolean;
}

/** Job runners (lib/jobs/run-jobs.ts) with a short interval, mail to `smtpPort`; output kept. */
export function startJobRunners(names: string[], opts: { smtpPort: number; intervalSeconds: number }) {
  const group = new ProcessGroup(logDir());
  const runners: RunnerHandle[] = names.map((name) => {
    const child = group.start(name, process.execPath, [...TSX, 'lib/jobs/run-jobs.ts'], {
      JOB_INTERVAL_SECONDS: String(opts.intervalSeconds), SMTP_PORT: String(opts.smtpPort), SMTP_HOST: '127.0.0.1',
    });
    let text = '';
    child.stdout?.on('data', (chunk: Buffer) => { text += chunk.toString(); });
    return { name, output: () => text, alive: () => child.exitCode === null && child.signalCode === null };
  });
  // Ready once each has logged its first margin pass (run or skipped): tsx has compiled, the loop is going.
  const ready = () => waitFor(async () => runners.every((r) => r.output().includes('[margin] ')), 60_000, 'the job runners to start');
  return { runners, ready, stop: () => group.stopAll() };
}

/** How often a runner logged each outcome of its margin pass (ran, or skipped for the lock). */
export function marginPassCounts(runner: RunnerHandle) {
  const lines = runner.output().split('\n').filter((l) => l.startsWith('[margin] '));
  const skipped = lines.filter((l) => l.includes('skipped')).length;
  return { ran: lines.length - skipped, skipped };
}

export type Reading = { t: string; v: number };

export async function postReadings(baseUrl: string, token: string, readings: Reading[]) {
  const res = await fetch(`${baseUrl}/api/v1/readings`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: JSON.stringify({ readings }),
  });
  const body = (await res.json()) as { accepted: number; duplicates: number; state: string };
  return { status: res.status, ...body, url: baseUrl };
}

/** Another node in a test organization: a copy of its first node under a new name. */
export async function addNodeLike(knex: Knex, org: TestOrg, name: string): Promise<number> {
  const { id: _id, created_at: _c, updated_at: _u, ...row } = await knex('nodes').where({ id: org.nodeId }).first();
  const [nodeId] = await knex('nodes').insert({ ...row, name });
  await knex('node_status').insert({ node_id: nodeId, org_id: org.orgId, state: 'new' });
  return nodeId;
}

/** Device tokens made through the real API by the organization's deployer. */
export async function deviceTokens(org: TestOrg, nodeIds: number[]): Promise<string[]> {
  const s = await signedIn(org.people.deployer.email, PASSWORD);
  const tokens: string[] = [];
  for (const nodeId of nodeIds) {
    const res = await s.agent.post(`/api/v1/nodes/${nodeId}/credentials`).set('origin', s.origin).send({ label: 'multi-instance' });
    if (res.status !== 201) throw new Error(`credential for node ${nodeId}: ${res.status}`);
    tokens.push(res.body.token as string);
  }
  return tokens;
}

export async function waitFor(check: () => Promise<boolean>, timeoutMs: number, what: string): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await sleep(250);
  }
}
