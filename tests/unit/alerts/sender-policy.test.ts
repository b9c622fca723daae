import { describe, expect, it } from 'vitest';
import { classifySmtpError, holdUntil, retryDelaySeconds } from '@/lib/mail/sender';

describe('SMTP failure classes (RFC 5321 §4.2.1: 4yz transient, 5yz permanent)', () => {
  it('4xx and unreachable relays are temporary, 5xx permanent', () => {
    expect(classifySmtpError({ code: 'EMESSAGE', responseCode: 451, message: 'Try again later' })).toMatchObject({ kind: 'temporary', connection: false });
    expect(classifySmtpError({ code: 'EMESSAGE', responseCode: 550, message: 'Mailbox unavailable' })).toMatchObject({ kind: 'permanent' });
    // nodemailer reports a refused connection as ESOCKET (seen on this machine), a timeout as ETIMEDOUT.
    expect(classifySmtpError({ code: 'ESOCKET', message: 'connect ECONNREFUSED 127.0.0.1:1' })).toMatchObject({ kind: 'temporary', connection: true });
    expect(classifySmtpError({ code: 'ETIMEDOUT', message: 'Connection timeout' })).toMatchObject({ kind: 'temporary', connection: true });
    expect(classifySmtpError(new Error('something odd'))).toMatchObject({ kind: 'temporary' });
    expect(classifySmtpError({ code: 'EMESSAGE', responseCode: 550, message: 'x' }).summary).toContain('550');
  });
});

describe('a relay that is itself unavailable (RFC 5321 §4.2.2, 421: service not available — from memory)', () => {
  it('marks 421 and a refused greeting or HELO as the relay being down, a 451 to one message not', () => {
    expect(classifySmtpError({ code: 'EENVELOPE', responseCode: 421, command: 'MAIL FROM', message: 'closing' })).toMatchObject({ kind: 'temporary', connection: true });
    expect(classifySmtpError({ code: 'EPROTOCOL', responseCode: 451, command: 'EHLO', message: 'busy' })).toMatchObject({ kind: 'temporary', connection: true });
    expect(classifySmtpError({ code: 'EPROTOCOL', responseCode: 454, command: 'HELO', message: 'busy' })).toMatchObject({ kind: 'temporary', connection: true });
    expect(classifySmtpError({ code: 'EMESSAGE', responseCode: 451, command: 'DATA', message: 'later' })).toMatchObject({ kind: 'temporary', connection: false });
  });

  it('retries sooner while the relay is down: at most 5 minutes between tries', () => {
    for (let attempts = 1; attempts <= 30; attempts++) {
      expect(retryDelaySeconds({ attempts, random: () => 1, relayDown: true })).toBeLessThanOrEqual(300);
    }
    expect(retryDelaySeconds({ attempts: 30, random: () => 1 })).toBe(3600);
  });
});

describe('backoff with jitter (derived here: half to all of min(1 h, 30 s·2^(n−1)))', () => {
  it('doubles per attempt, stays within its jitter band, and caps at one hour', () => {
    expect(retryDelaySeconds({ attempts: 1, random: () => 0 })).toBe(15);
    expect(retryDelaySeconds({ attempts: 1, random: () => 1 })).toBe(30);
    expect(retryDelaySeconds({ attempts: 4, random: () => 0.5 })).toBe(180);
    expect(retryDelaySeconds({ attempts: 30, random: () => 1 })).toBe(3600);
    for (let n = 1; n < 15; n++) {
      const d = retryDelaySeconds({ attempts: n });
      const ceiling = Math.min(3600, 30 * 2 ** (n - 1));
      expect(d).toBeGreaterThanOrEqual(ceiling / 2);
      expect(d).toBeLessThanOrEqual(ceiling);
    }
  });

  it('a held message waits until the oldest send of the hour ages out', () => {
    const now = new Date('2026-11-20T04:00:00Z');
    const sent = [new Date('2026-11-20T03:20:00Z'), new Date('2026-11-20T03:50:00Z')];
    expect(holdUntil({ sentTimes: sent, now }).toISOString()).toBe('2026-11-20T04:20:00.000Z');
  });
});
