// The pieces of the mail-outage test (issue 9): a relay that answers but fails every command
// with a temporary reply, a fleet of short nodes in several organizations whose readings are
// written ahead for the whole simulated night, and the job runner's ticks on a simulated clock.
import net from 'node:net';
import type { Knex } from 'knex';
import { runMailPass } from '@/lib/jobs/mail-pass';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import type { MailPassReport, SmtpSettings } from '@/lib/mail/sender';
import { createTestOrg, insertReading, startCatcher, voltsForMargin, type TestOrg } from '../alerts-fixtures';

/** An SMTP relay that greets (220), then answers every command with `code` (421 closes the channel, RFC 5321 §3.8). */
export async function startFailingRelay(port: number, code: 421 | 451) {
  const sockets = new Set<net.Socket>();
  const server = net.createServer((socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
    socket.on('error', () => undefined);
    socket.write('220 relay.watch-test.example ESMTP\r\n');
    socket.on('data', (chunk) => {
      for (const _line of chunk.toString('latin1').split('\r\n').filter(Boolean)) {
        socket.write(`${code} 4.3.2 System not accepting network messages, try later\r\n`);
        if (code === 421) socket.end();
      }
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return {
    close: () => new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      server.close(() => resolve());
    }),
  };
}

/**
 * The relay's outage on `port`: nobody listening (connection refused), a relay failing every
 * command, or the catcher deferring every message (451 after DATA). restore() brings the real
 * catcher back on the same port and returns it.
 */
export async function startOutage({ port, failing, label }: { port: number; failing: null | 421 | 451 | 'tempfail'; label: string }) {
  let catcher = failing === 'tempfail' ? await startCatcher(label, port) : null;
  if (catcher) catcher.catcher.mode = 'tempfail';
  let relay = typeof failing === 'number' ? await startFailingRelay(port, failing) : null;
  return {
    received: () => catcher?.catcher.received ?? 0,
    restore: async () => {
      await relay?.close();
      relay = null;
      catcher ??= await startCatcher(label, port);
      catcher.catcher.mode = 'accept';
      return catcher;
    },
    stop: async () => {
      await relay?.close();
      await catcher?.catcher.close();
    },
  };
}

/** Another node of the organization, a copy of its first one under a new name. */
export async function addNode(knex: Knex, org: TestOrg, name: string): Promise<number> {
  const { id: _id, created_at: _c, updated_at: _u, ...template } = await knex('nodes').where({ id: org.nodeId }).first();
  const [nodeId] = await knex('nodes').insert({ ...template, name });
  await knex('node_status').insert({ node_id: nodeId, org_id: org.orgId, state: 'new' });
  return nodeId;
}

/** Short-reserve alerts, and only those, by e-mail at once for these members. */
export async function subscribeShort(knex: Knex, membershipIds: number[]) {
  for (const membershipId of membershipIds) {
    await knex('alert_subscriptions').insert({ membership_id: membershipId, site_id: null, kinds: JSON.stringify(['reserve_short']), delivery: 'immediate' });
  }
}

export interface PlannedNode {
  nodeId: number;
  orgId: number;
  /** Minutes after the start at which its readings turn short (margin 0.5), healthy (1.8) before; readings come every 15 min. */
  shortFromMinutes: number;
}

/** Readings every 15 min (the nodes' cadence) from an hour before `start` to `hours` after it. */
export async function writeNightReadings(knex: Knex, plan: PlannedNode[], start: Date, hours: number) {
  for (const node of plan) {
    for (let minutes = -60; minutes <= hours * 60; minutes += 15) {
      const t = new Date(start.getTime() + minutes * 60_000);
      // Before its turn a node holds a margin of 1.2 (thin, no alert). Held at margin m through
      // the night, a bank falls at m times the modelled draw (derived here: reserve = m × need);
      // 1.2 stays under the 1.3 at which the projection switches to the measured draw.
      await insertReading(knex, node.nodeId, t, voltsForMargin({ at: t, margin: minutes >= node.shortFromMinutes ? 0.5 : 1.2 }));
    }
  }
}

export async function createOutageOrg(knex: Knex, opts: { capPerHour: number; label: string }) {
  // Reminders after 24 h, so that within the simulated night each alert mails each person once.
  const org = await createTestOrg(knex, { org: { mail_cap_per_hour: opts.capPerHour, resend_short_hours: 24 }, nodeName: `${opts.label}-1` });
  // The owner too, explicitly: the owner default also covers dark and silent nodes, and this
  // scenario counts the short alerts' e-mails alone.
  await subscribeShort(knex, [org.people.owner.membershipId, org.people.deployer.membershipId, org.people.viewer.membershipId]);
  return org;
}

/** The job runner's loop (lib/jobs/runner.ts) on a simulated clock: a mail pass every 10 s, a margin pass every 60 s. */
export const MAIL_TICK_MS = 10_000;
export const MARGIN_EVERY_MS = 60_000;

export async function runTicks(opts: {
  knex: Knex; from: Date; to: Date; orgIds: number[]; smtp: SmtpSettings; appUrl: string;
  afterTick: (now: Date, mail: MailPassReport) => Promise<boolean | void>;
}): Promise<Date> {
  let now = opts.from;
  for (let t = opts.from.getTime(); t < opts.to.getTime(); t += MAIL_TICK_MS) {
    now = new Date(t);
    if ((t - opts.from.getTime()) % MARGIN_EVERY_MS === 0) {
      const margin = await runMarginPass({ knex: opts.knex, now, appUrl: opts.appUrl, orgIds: opts.orgIds });
      if (!margin.ran || margin.failures.length) throw new Error(`margin pass at ${now.toISOString()}: ${JSON.stringify(margin)}`);
    }
    const mail = await runMailPass({ knex: opts.knex, now, smtp: opts.smtp });
    if (!mail.ran) throw new Error(`mail pass skipped at ${now.toISOString()}`);
    if ((await opts.afterTick(now, mail)) === true) break;
  }
  return now;
}
