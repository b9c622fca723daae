import { closeDb, db } from '../db/knex';
import { getEnv } from '../env';
import { openMaintenanceKnex } from './retention-pass';
import { startJobRunner } from './runner';

// Entry point: `tsx lib/jobs/run-jobs.ts` (started by npm run demo; runnable alone with the
// profile's environment). SIGINT/SIGTERM finish the pass in flight, close the pool and exit.
function main() {
  const env = getEnv();
  // Partition upkeep needs the maintenance user; without its password the step is left out.
  const maintenance = env.DB_MAINT_PASSWORD ? openMaintenanceKnex() : null;
  const runner = startJobRunner({
    knex: db(),
    intervalSeconds: env.JOB_INTERVAL_SECONDS,
    appUrl: env.APP_URL,
    smtp: { host: env.SMTP_HOST, port: env.SMTP_PORT, from: env.MAIL_FROM },
    ...(maintenance ? { retention: { knex: maintenance, days: env.READINGS_RETENTION_DAYS } } : {}),
  });
  console.log(`[jobs] margin pass every ${env.JOB_INTERVAL_SECONDS} s, mail to ${env.SMTP_HOST}:${env.SMTP_PORT}`);
  console.log(maintenance
    ? `[jobs] partition upkeep hourly; raw readings kept ${env.READINGS_RETENTION_DAYS === null ? 'forever' : `${env.READINGS_RETENTION_DAYS} days`}`
    : '[jobs] partition upkeep off: DB_MAINT_PASSWORD is not set');
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[jobs] ${signal}: finishing the current pass…`);
    runner.stop().then(closeDb).then(() => maintenance?.destroy()).then(() => process.exit(0), (e) => {
      console.error(e);
      process.exit(1);
    });
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main();
