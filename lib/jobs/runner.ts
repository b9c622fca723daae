import type { Knex } from 'knex';
import type { SmtpSettings } from '../mail/sender';
import { runDigestPass } from './digest-pass';
import { runMailPass } from './mail-pass';
import { runMarginPass } from './margin-pass';
import { describeRetention, runRetentionPass } from './retention-pass';

/**
 * The job loop: a margin pass (then the digest) every `intervalSeconds`, a mail pass more often
 * so invitations and resets do not wait a minute. stop() lets the pass in flight finish (each
 * node and each e-mail commits on its own) and then returns; nothing half-written is left.
 * With `retention` (a pool as the maintenance user) the partition upkeep runs about hourly.
 */
export interface JobRunnerOptions {
  knex: Knex;
  intervalSeconds: number;
  appUrl: string;
  smtp: SmtpSettings;
  retention?: { knex: Knex; days: number | null };
  log?: (line: string) => void;
}

const MAIL_EVERY_SECONDS = 10;
const RETENTION_EVERY_SECONDS = 3600;

export function startJobRunner(opts: JobRunnerOptions): { stop: () => Promise<void>; done: Promise<void> } {
  const log = opts.log ?? ((line: string) => console.log(line));
  let stopping = false;
  let wake: (() => void) | null = null;
  const sleep = (ms: number) => new Promise<void>((resolve) => {
    const timer = setTimeout(resolve, ms);
    wake = () => { clearTimeout(timer); resolve(); };
  });

  const done = (async () => {
    let nextMarginAt = 0;
    let nextRetentionAt = 0;
    while (!stopping) {
      const now = new Date();
      if (now.getTime() >= nextMarginAt) {
        nextMarginAt = now.getTime() + opts.intervalSeconds * 1000;
        await guarded(log, 'margin', async () => {
          const r = await runMarginPass({ knex: opts.knex, now, appUrl: opts.appUrl, log });
          if (!r.ran) return 'skipped: another runner holds the lock';
          const opened = r.nodes.flatMap((n) => n.opened.map((k) => `${n.nodeId}:${k}`));
          const resolved = r.nodes.flatMap((n) => n.resolved.map((k) => `${n.nodeId}:${k}`));
          return `${r.nodes.length} nodes, opened [${opened.join(' ')}], resolved [${resolved.join(' ')}], ${r.failures.length} failed`;
        });
        await guarded(log, 'digest', async () => `${await runDigestPass({ knex: opts.knex, now, appUrl: opts.appUrl })} written`, true);
      }
      const retention = opts.retention;
      if (retention && now.getTime() >= nextRetentionAt) {
        nextRetentionAt = now.getTime() + RETENTION_EVERY_SECONDS * 1000;
        await guarded(log, 'retention', async () => describeRetention(await runRetentionPass({ knex: retention.knex, retentionDays: retention.days, now }), retention.days));
      }
      await guarded(log, 'mail', async () => {
        const r = await runMailPass({ knex: opts.knex, smtp: opts.smtp });
        return r.claimed ? `sent ${r.sent}, retrying ${r.retrying}, dead ${r.dead}, held ${r.held}` : '';
      }, true);
      if (!stopping) await sleep(Math.min(MAIL_EVERY_SECONDS, opts.intervalSeconds) * 1000);
    }
  })();

  return {
    done,
    stop: async () => {
      stopping = true;
      wake?.();
      await done;
    },
  };
}

/** A failing pass (database restarting, say) is logged and tried again on the next tick. */
async function guarded(log: (line: string) => void, name: string, fn: () => Promise<string>, quietWhenEmpty = false) {
  try {
    const line = await fn();
    if (line || !quietWhenEmpty) log(`[${name}] ${line}`);
  } catch (error) {
    log(`[${name}] failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}
