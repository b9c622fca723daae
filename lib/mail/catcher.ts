import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

/**
 * A local SMTP fake on loopback, in place of a hosted relay. Every message it accepts is
 * written as an .eml file. Tests switch it to answer 451 (try later) or 550 (refused).
 */
export type CatcherMode = 'accept' | 'tempfail' | 'reject';

export class MailCatcher {
  mode: CatcherMode = 'accept';
  received = 0;
  private server: SMTPServer;

  constructor(private opts: { port: number; dir: string; host?: string }) {
    mkdirSync(opts.dir, { recursive: true });
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      size: 10 * 1024 * 1024,
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          if (this.mode === 'tempfail') return callback(Object.assign(new Error('Try again later'), { responseCode: 451 }));
          if (this.mode === 'reject') return callback(Object.assign(new Error('Mailbox unavailable'), { responseCode: 550 }));
          this.received += 1;
          const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${session.id}-${this.received}.eml`;
          writeFileSync(path.join(this.opts.dir, name), Buffer.concat(chunks));
          callback();
        });
      },
    });
  }

  listen(): Promise<void> {
    return new Promise((resolve, reject) => {
      this.server.once('error', reject);
      this.server.listen(this.opts.port, this.opts.host ?? '127.0.0.1', () => resolve());
    });
  }

  close(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()));
  }
}
