import { spawn } from 'node:child_process';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { createTestOrg, insertReading, messagesTo, startCatcher, voltsForMargin } from './alerts-fixtures';

// The runner as the demo starts it: `tsx lib/jobs/run-jobs.ts`, a pass a second, real time.
afterAll(closeDb);

describe('the job runner process', () => {
  it('opens the alert, delivers its e-mail and stops cleanly on SIGTERM', async () => {
    const mail = await startCatcher('process');
    const org = await createTestOrg(db());
    const t = new Date(Date.now() - 30_000);
    await insertReading(db(), org.nodeId, t, voltsForMargin({ at: t, margin: 0.5 }));
    const child = spawn(path.resolve('node_modules/.bin/tsx'), ['lib/jobs/run-jobs.ts'], {
      env: { ...process.env, JOB_INTERVAL_SECONDS: '1', SMTP_PORT: String(mail.port) },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    try {
      const until = Date.now() + 25_000;
      while (Date.now() < until && messagesTo(mail.dir, org.people.owner.email).length === 0) await new Promise((r) => setTimeout(r, 250));
      expect(messagesTo(mail.dir, org.people.owner.email), output).toHaveLength(1);
      expect(output).toMatch(/\[margin\] \d+ nodes/);
      const alert = await db()('alerts').where({ node_id: org.nodeId, kind: 'reserve_short' }).first();
      expect(alert.status).toBe('open');
    } finally {
      child.kill('SIGTERM');
      expect(await exited, output).toBe(0);
      await mail.catcher.close();
    }
    expect(output).toContain('SIGTERM: finishing the current pass');
  }, 40_000);
});
