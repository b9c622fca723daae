import { getEnv } from '../env';
import { MailCatcher } from './catcher';

// Entry point: `tsx lib/mail/run-catcher.ts` (started by npm run demo and npm test).
const env = getEnv();
const catcher = new MailCatcher({ port: env.SMTP_PORT, dir: env.MAIL_DIR });
catcher.listen().then(() => console.log(`mail catcher on 127.0.0.1:${env.SMTP_PORT}, writing ${env.MAIL_DIR}`));
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => catcher.close().then(() => process.exit(0)));
