/**
 * The outbox's retry policy: which SMTP failures are worth retrying, and when. A 4xx reply, a
 * refused or dropped connection and a timeout are temporary; a 5xx reply (or a message the
 * transport itself refuses) is permanent. Unknown errors count as temporary: retrying loses
 * nothing. A failure of the relay itself (unreachable, 421 "service not available", or a
 * refused greeting or HELO) says nothing about the message: the pass stops trying the others,
 * and the message is retried sooner, so that mail leaves within minutes of the relay's return.
 */
export interface SmtpVerdict {
  kind: 'temporary' | 'permanent';
  /** The relay itself is unavailable (unreachable, or refusing the session), not this message. */
  connection: boolean;
  summary: string;
}

const HOUR_MS = 3_600_000;
/** A temporary failure that lasts this long (from the row's creation) becomes a dead letter. */
export const GIVE_UP_MS = 48 * HOUR_MS;

const CONNECTION_CODES = new Set(['ECONNECTION', 'ESOCKET', 'ETIMEDOUT', 'ECONNREFUSED', 'ECONNRESET', 'EDNS', 'EGREETING', 'ETLS', 'EPROTOCOL']);
// nodemailer names the command a failure answered; these open the session, before any message.
const SESSION_COMMANDS = new Set(['CONN', 'EHLO', 'HELO', 'LHLO']);

export function classifySmtpError(error: unknown): SmtpVerdict {
  const e = (error ?? {}) as { code?: string; responseCode?: number; command?: string; message?: string };
  const summary = `${e.responseCode ? `${e.responseCode} ` : ''}${e.code ? `${e.code}: ` : ''}${e.message ?? String(error)}`.slice(0, 1000);
  if (typeof e.responseCode === 'number' && e.responseCode >= 500) return { kind: 'permanent', connection: false, summary };
  if (typeof e.responseCode === 'number' && e.responseCode >= 400) {
    // RFC 5321 §4.2.2 (from memory): 421 is "service not available, closing transmission channel", whatever the command.
    const relay = e.responseCode === 421 || (e.command !== undefined && SESSION_COMMANDS.has(e.command));
    return { kind: 'temporary', connection: relay, summary };
  }
  if (e.code && CONNECTION_CODES.has(e.code)) return { kind: 'temporary', connection: true, summary };
  if (e.code === 'EENVELOPE' || e.code === 'EMESSAGE') return { kind: 'permanent', connection: false, summary };
  return { kind: 'temporary', connection: false, summary };
}

const BASE_SECONDS = 30;
const MAX_SECONDS = 3600;
/**
 * While the relay is down each pass tries one message and leaves the rest (sender.ts), so a
 * short ceiling costs one connection attempt a pass, and bounds the wait after the relay is back.
 */
export const RELAY_DOWN_MAX_SECONDS = 300;

/**
 * Exponential backoff with "equal jitter": the n-th retry waits between half and all of
 * min(ceiling, 30 s·2^(n−1)), so senders that failed together do not retry in lockstep. The
 * ceiling is 1 h for a message the relay deferred, 5 min when the relay itself was unavailable.
 */
export function retryDelaySeconds({ attempts, random = Math.random, relayDown = false }: { attempts: number; random?: () => number; relayDown?: boolean }): number {
  const ceiling = Math.min(relayDown ? RELAY_DOWN_MAX_SECONDS : MAX_SECONDS, BASE_SECONDS * 2 ** Math.max(0, attempts - 1));
  return ceiling / 2 + (ceiling / 2) * random();
}

/** When to try again: after the backoff, but never past the give-up time, so that the last try is at 48 h. */
export function nextAttemptAt({ now, createdAt, delaySeconds }: { now: Date; createdAt: Date; delaySeconds: number }): Date {
  return new Date(Math.min(now.getTime() + delaySeconds * 1000, createdAt.getTime() + GIVE_UP_MS));
}

/** A held message may go once the oldest send of the last hour has aged out of it. */
export function holdUntil({ sentTimes, now }: { sentTimes: Date[]; now: Date }): Date {
  const oldest = sentTimes.reduce((min, t) => Math.min(min, t.getTime()), Infinity);
  const reopens = Number.isFinite(oldest) ? oldest + HOUR_MS : now.getTime();
  return new Date(Math.max(reopens, now.getTime() + 60_000));
}
