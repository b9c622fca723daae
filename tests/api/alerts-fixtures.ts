// Throwaway organizations, sites, nodes and people for the margin-watch tests, written straight
// into the test database, plus a private SMTP catcher per test file. Invented names only.
import { randomUUID } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { hashPassword } from '@/lib/auth/password';
import { evaluateNode } from '@/lib/energy';
import { getEnv } from '@/lib/env';
import { MailCatcher } from '@/lib/mail/catcher';
import type { NodeModelSpec } from '@/lib/status/node-spec';

export const PASSWORD = 'a long enough passphrase';
export const TIME_ZONE = 'America/Los_Angeles';

/** 2 × 25 F / 2.7 V in series (12.5 F, 5.4 V), a 3.3 V boost, a 15-minute cadence; a valley near 47° N. */
export const spec: NodeModelSpec = {
  bank: { cellsSeries: 2, cellsParallel: 1, cellFarads: 25, cellRatedVolts: 2.7, cellEsrOhms: 0.03, cellLeakageAmps: 12e-6 },
  converter: { startVolts: 0.8, cutoffVolts: 0.5, outputVolts: 3.3, efficiency: 0.85, inputLimitAmps: 1.8 },
  load: { sleepAmps: 10e-6, awakeSeconds: 2, awakeAmps: 0.08, burstSeconds: 1, burstAmps: 0.22, intervalSeconds: 900, maxIntervalSeconds: 3600 },
  site: { lat: 47.06, lon: -120.5, rechargeElevationDeg: 3 },
};

/** A second pool to the same database, as a second runner process would have. */
export function secondKnex(): Knex {
  const env = getEnv();
  return knexFactory({
    client: 'mysql2',
    connection: { host: env.DB_HOST, port: env.DB_PORT, user: env.DB_USER, password: env.DB_PASSWORD, database: env.DB_NAME, timezone: 'Z' },
    pool: { min: 0, max: 4 },
  });
}

export interface TestOrg {
  orgId: number;
  siteId: number;
  nodeId: number;
  people: Record<'owner' | 'deployer' | 'viewer', { email: string; membershipId: number }>;
}

export async function createTestOrg(knex: Knex, opts: { nodeName?: string; siteName?: string; org?: Record<string, unknown> } = {}): Promise<TestOrg> {
  const tag = randomUUID().slice(0, 8);
  const [orgId] = await knex('organizations').insert({ name: `Test org ${tag}`, slug: `test-${tag}`, ...opts.org });
  const [siteId] = await knex('sites').insert({ org_id: orgId, name: opts.siteName ?? `Test site ${tag}`, lat: spec.site.lat, lon: spec.site.lon, time_zone: TIME_ZONE, recharge_elevation_deg: 3 });
  const { bank: b, converter: c, load: l } = spec;
  const [nodeId] = await knex('nodes').insert({
    org_id: orgId, site_id: siteId, name: opts.nodeName ?? `TN-${tag}`, purpose: 'test',
    cells_series: b.cellsSeries, cells_parallel: b.cellsParallel, cell_farads: b.cellFarads, cell_rated_volts: b.cellRatedVolts,
    cell_esr_ohms: b.cellEsrOhms, cell_leakage_amps: b.cellLeakageAmps, start_volts: c.startVolts, cutoff_volts: c.cutoffVolts,
    output_volts: c.outputVolts, efficiency: JSON.stringify(c.efficiency), input_limit_amps: c.inputLimitAmps,
    sleep_amps: l.sleepAmps, awake_seconds: l.awakeSeconds, awake_amps: l.awakeAmps, burst_seconds: l.burstSeconds, burst_amps: l.burstAmps,
    interval_seconds: l.intervalSeconds, max_interval_seconds: l.maxIntervalSeconds,
  });
  await knex('node_status').insert({ node_id: nodeId, org_id: orgId, state: 'new' });
  const hash = await hashPassword(PASSWORD);
  const people = {} as TestOrg['people'];
  for (const role of ['owner', 'deployer', 'viewer'] as const) {
    const email = `${role}-${tag}@watch-test.example`;
    const [userId] = await knex('users').insert({ email, name: `${role} ${tag}`, password_hash: hash });
    const [membershipId] = await knex('memberships').insert({ org_id: orgId, user_id: userId, role });
    people[role] = { email, membershipId };
  }
  return { orgId, siteId, nodeId, people };
}

/** The bank volts at which the model gives `margin` at `at` (bisection; margin rises with volts). */
export function voltsForMargin({ at, margin }: { at: Date; margin: number }): number {
  return voltsForMarginOf(spec, at, margin);
}

/** The same for any node model. */
export function voltsForMarginOf(model: NodeModelSpec, at: Date, margin: number): number {
  let low = model.converter.cutoffVolts;
  let high = model.bank.cellsSeries * model.bank.cellRatedVolts * 0.97;
  const marginAt = (volts: number) => evaluateNode({ ...model, volts, at }).margin;
  if (marginAt(high) < margin) throw new Error(`margin ${margin} is out of reach at ${at.toISOString()}`);
  for (let i = 0; i < 60; i++) {
    const mid = (low + high) / 2;
    if (marginAt(mid) < margin) low = mid;
    else high = mid;
  }
  return high;
}

export async function insertReading(knex: Knex, nodeId: number, t: Date, volts: number, panelVolts: number | null = null) {
  await knex('readings').insert({ node_id: nodeId, t, v: volts, vp: panelVolts });
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

export async function startCatcher(name: string, port?: number) {
  const dir = path.join(currentTestProfile().dataDir, 'mail-watch', `${name}-${randomUUID().slice(0, 6)}`);
  const catcherPort = port ?? (await freePort());
  const catcher = new MailCatcher({ port: catcherPort, dir });
  await catcher.listen();
  return { catcher, dir, port: catcherPort };
}

/** Messages in a catcher's folder, headers unfolded and their RFC 2047 words decoded, bodies decoded from quoted-printable. */
export function readMessages(dir: string): { headers: string; body: string; raw: string }[] {
  let files: string[] = [];
  try {
    files = readdirSync(dir).filter((f) => f.endsWith('.eml')).sort();
  } catch {
    return [];
  }
  return files.map((f) => {
    const raw = readFileSync(path.join(dir, f), 'utf8');
    const split = raw.indexOf('\r\n\r\n') >= 0 ? raw.indexOf('\r\n\r\n') : raw.indexOf('\n\n');
    const headers = decodeEncodedWords(raw.slice(0, split).replace(/\r?\n[ \t]+/g, ' '));
    return { headers, body: decodeQuotedPrintable(raw.slice(split)), raw };
  });
}

export function messagesTo(dir: string, address: string) {
  return readMessages(dir).filter((m) => new RegExp(`^To: .*${address.replace(/[.+]/g, '\\$&')}`, 'mi').test(m.headers));
}

// RFC 2047 §4.2 "Q" words, as nodemailer writes a subject that is not plain ASCII; the space
// between two adjacent encoded words is not part of the text (§6.2).
function decodeEncodedWords(headers: string): string {
  return headers
    .replace(/(\?=)[ \t]+(=\?)/g, '$1$2')
    .replace(/=\?UTF-8\?Q\?([^?]*)\?=/gi, (_, q: string) => decodeQuotedPrintable(q.replace(/_/g, ' ')));
}

function decodeQuotedPrintable(text: string): string {
  const joined = text.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    if (joined[i] === '=' && /^[0-9A-F]{2}$/.test(joined.slice(i + 1, i + 3))) {
      bytes.push(parseInt(joined.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(joined[i], 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

export const SMTP_FROM = 'Duskwatch test <alerts@watch-test.example>';
