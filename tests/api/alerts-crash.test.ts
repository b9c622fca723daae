import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { createTestOrg, insertReading, messagesTo, startCatcher, voltsForMargin } from './alerts-fixtures';

// Crash safety of the margin watch (issue 9): the job runner killed with SIGKILL at moments in
// and around its passes, then started again. The alert and its outbox rows are one transaction
// and the alert is unique per node and kind, so: no duplicate alert, no lost e-mail, and at most
// one duplicate e-mail (a message handed to SMTP just before the kill, then sent again).
afterAll(closeDb);

function startRunner(smtpPort: number): ChildProcess {
  // node itself runs the runner (tsx as a loader), so SIGKILL hits the runner and no orphan is left.
  return spawn(process.execPath, ['--import', 'tsx', 'lib/jobs/run-jobs.ts'], {
    env: { ...process.env, JOB_INTERVAL_SECONDS: '1', SMTP_PORT: String(smtpPort) },
    stdio: 'ignore',
  });
}

const killHard = (child: ChildProcess) => new Promise<void>((resolve) => {
  if (child.exitCode !== null || child.signalCode !== null) return resolve();
  child.once('exit', () => resolve());
  child.kill('SIGKILL');
});

describe('the job runner killed mid-pass', () => {
  it.each([400, 1500, 2600])('killed after %i ms and restarted: one alert, its e-mail once (at most one duplicate)', async (delayMs) => {
    const mail = await startCatcher(`crash-${delayMs}`);
    const org = await createTestOrg(db(), { nodeName: `crash-${delayMs}`, siteName: `crash site ${delayMs}` });
    const t = new Date(Date.now() - 30_000);
    await insertReading(db(), org.nodeId, t, voltsForMargin({ at: t, margin: 0.5 }));
    const first = startRunner(mail.port);
    await new Promise((r) => setTimeout(r, delayMs));
    await killHard(first);
    const second = startRunner(mail.port);
    try {
      const until = Date.now() + 20_000;
      while (Date.now() < until && messagesTo(mail.dir, org.people.owner.email).length === 0) await new Promise((r) => setTimeout(r, 250));
      await killHard(second);
      const alerts = await db()('alerts').where({ node_id: org.nodeId, kind: 'reserve_short' });
      expect(alerts).toHaveLength(1); // no duplicate alert, none lost
      const outbox = await db()('email_outbox').where({ alert_id: alerts[0].id });
      expect(outbox.length).toBe(1); // its e-mail written once, with the alert
      // Delivered, or still pending behind the sending lease of the killed runner (5 min), after
      // which the next mail pass sends it (tests/api/mail-delivery.test.ts covers the later send).
      expect(['sent', 'pending']).toContain(outbox[0].status);
      const mails = messagesTo(mail.dir, org.people.owner.email).length;
      if (outbox[0].status === 'sent') expect(mails).toBeGreaterThanOrEqual(1);
      expect(mails).toBeLessThanOrEqual(2); // at most one duplicate
    } finally {
      await killHard(second);
      await mail.catcher.close();
    }
  }, 60_000);
});
