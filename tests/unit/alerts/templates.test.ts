import { describe, expect, it } from 'vitest';
import { buildAlertMail, likelyCause } from '@/lib/mail/templates/alert-mail';
import { alertLine } from '@/lib/alerts/labels';
import { alertDetail } from '@/lib/alerts/rules';
import { BANK_FARADS, MAX_VOLTS, spec, statusWith } from './fixtures';

const status = statusWith({ state: 'short', margin: 0.62, volts: 2.1, brownout_at: new Date('2026-11-20T11:41:00Z'), recharge_at: new Date('2026-11-20T15:38:00Z') });
const detail = alertDetail({ status, thresholds: { steady: 1.5, thin: 1 }, alertOnThin: false, maxVolts: MAX_VOLTS, night: null, day: null, missedDay: null, measuredWatts: null });

describe('the alert e-mail', () => {
  it('names brownout and recharge in the site zone (America/Los_Angeles is UTC−8 in November: common practice)', () => {
    const mail = buildAlertMail({ kind: 'reserve_short', detail, nodeId: 42, nodeName: 'N-1', siteName: 'Culvert', timeZone: 'America/Los_Angeles', appUrl: 'http://127.0.0.1:3000/' });
    expect(mail.text).toContain('Fri 20 Nov 03:41 PST'); // 11:41 UTC − 8 h
    expect(mail.text).toContain('Fri 20 Nov 07:38 PST'); // 15:38 UTC − 8 h
    expect(mail.subject).toContain('Fri 20 Nov 03:41 PST');
    expect(mail.text).toContain('http://127.0.0.1:3000/nodes/42');
    expect(mail.text).toContain('Stretch the report interval');
    expect(mail.html).toContain('href="http://127.0.0.1:3000/nodes/42"');
  });

  it('keeps a name with line breaks on one subject line and escapes it in HTML', () => {
    const evil = 'Pump<b>\r\nBcc: victim@test.example\r\n';
    const mail = buildAlertMail({ kind: 'node_dark', detail, nodeId: 1, nodeName: evil, siteName: 'S\nX-Injected: 1', timeZone: 'UTC', appUrl: 'http://x' });
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.html).not.toContain('<b>');
    expect(mail.html).toContain('Pump&lt;b&gt;');
    expect(mail.text.split('\n').some((l) => l.startsWith('Bcc:'))).toBe(false);
  });

  it('explains the likely cause from measured vs modelled draw', () => {
    expect(likelyCause({ ...detail, measured_watts: 0.006, modelled_watts: 0.002, draw_ratio: 3 })).toMatch(/stuck awake/);
    expect(likelyCause({ ...detail, measured_watts: 0.0021, modelled_watts: 0.002, draw_ratio: 1.05 })).toMatch(/bank is too small/);
    expect(likelyCause(detail)).toMatch(/no measured draw yet/);
  });

  it('gives the over-voltage figure itself, in the line, the subject and the body, and the margin with its ×', () => {
    const over = alertDetail({ status: statusWith({ volts: 9.5 }), thresholds: { steady: 1.5, thin: 1 }, alertOnThin: false, maxVolts: 5.4, night: null, day: null, missedDay: null, measuredWatts: null });
    // 9.5 / 5.4 = 1.759 → 176 % (derived here)
    expect(alertLine('over_voltage', over)).toContain('9.50 V, 176 % of its rated 5.40 V');
    const mail = buildAlertMail({ kind: 'over_voltage', detail: over, nodeId: 7, nodeName: 'N-7', siteName: 'Weir', timeZone: 'UTC', appUrl: 'http://x' });
    expect(mail.subject).toContain('over-voltage (9.50 V, 176 % of its rated 5.40 V)');
    // The state of charge stops at 100 % above the rating (lib/energy/bank.ts clamps it); the rating is said beside it.
    expect(mail.text).toMatch(/Bank:\s+9\.50 V, over the rated 5\.40 V/);
    const withCutoff = buildAlertMail({ kind: 'over_voltage', detail: over, nodeId: 7, nodeName: 'N-7', siteName: 'Weir', timeZone: 'UTC', appUrl: 'http://x', cutoffVolts: 0.5 });
    expect(withCutoff.text).toMatch(/Bank:\s+9\.50 V, state of charge 100 % \(of the energy above the 0\.50 V cutoff\), over the rated 5\.40 V/);
    expect(mail.text).toMatch(/Likely cause: a charger that does not regulate/);
    expect(buildAlertMail({ kind: 'reserve_short', detail, nodeId: 1, nodeName: 'N', siteName: 'S', timeZone: 'UTC', appUrl: 'http://x' }).text).toMatch(/Night margin:\s+0\.62×/);
  });
});

describe('the bank figure of the alert e-mail', () => {
  const cutoffVolts = spec.converter.cutoffVolts; // 0.5 V
  const at = (volts: number, cutoff: number | null = cutoffVolts) => {
    const d = alertDetail({ status: statusWith({ state: 'thin', margin: 1.2, volts }), thresholds: { steady: 1.5, thin: 1 }, alertOnThin: true, maxVolts: MAX_VOLTS, night: null, day: null, missedDay: null, measuredWatts: null });
    return buildAlertMail({ kind: 'reserve_thin', detail: d, nodeId: 5, nodeName: 'N-5', siteName: 'Weir', timeZone: 'UTC', appUrl: 'http://x', cutoffVolts: cutoff });
  };

  it('gives the state of charge by energy, worded as on the node page, beside the volts', () => {
    // Independent check from E = ½CV² (textbook capacitor energy, DESIGN.md §3): the share of
    // the energy between the 0.5 V cutoff and the full 5.4 V of the 12.5 F fixture bank.
    const joules = (v: number) => 0.5 * BANK_FARADS * v * v;
    const expected = Math.round((100 * (joules(4.61) - joules(0.5))) / (joules(MAX_VOLTS) - joules(0.5)));
    expect(expected).toBe(73); // (4.61² − 0.5²) / (5.4² − 0.5²) = 21.0021 / 28.91 = 0.7265 (derived here)
    const mail = at(4.61);
    expect(mail.text).toMatch(new RegExp(`Bank:\\s+4\\.61 V, state of charge ${expected} % \\(of the energy above the 0\\.50 V cutoff\\)`));
    expect(mail.html).toContain(`4.61 V, state of charge ${expected} % (of the energy above the 0.50 V cutoff)`);
    // Never the share of volts: 4.61 / 5.4 = 85 % (derived here).
    expect(mail.text).not.toContain('85 %');
    expect(mail.text).not.toMatch(/% of the rated/);
  });

  it('is 0 % at the cutoff and below it, and half the volts is far less than half the charge', () => {
    expect(at(0.5).text).toMatch(/state of charge 0 %/);
    expect(at(0.3).text).toMatch(/state of charge 0 %/);
    // 2.7 V is half of 5.4 V: (2.7² − 0.5²) / 28.91 = 7.04 / 28.91 = 24 % (derived here from E = ½CV²).
    expect(at(2.7).text).toMatch(/Bank:\s+2\.70 V, state of charge 24 %/);
  });

  it('without the cutoff gives the volts and the rating only, never a share of volts', () => {
    const text = at(4.61, null).text;
    expect(text).toMatch(/Bank:\s+4\.61 V \(rated 5\.40 V\)/);
    expect(text).not.toMatch(/%.*rated/);
  });
});

describe('the still-dark-after-a-day e-mail', () => {
  it('names the day it missed in the site zone, says to visit, and gives the caution about a charged bank', () => {
    const missedDay = { startAt: new Date('2026-11-20T15:38:00Z'), endAt: new Date('2026-11-21T00:47:00Z') };
    const dark = alertDetail({ status: statusWith({ state: 'dark', volts: 1.9 }), thresholds: { steady: 1.5, thin: 1 }, alertOnThin: false, maxVolts: MAX_VOLTS, night: null, day: null, missedDay, measuredWatts: null });
    const mail = buildAlertMail({ kind: 'dark_through_day', detail: dark, nodeId: 9, nodeName: 'N-9', siteName: 'Ridge', timeZone: 'America/Los_Angeles', appUrl: 'http://x' });
    expect(mail.subject).toContain('still dark after a whole day of sun');
    // America/Los_Angeles is UTC−8 in November (common practice): 15:38Z is 07:38, 00:47Z the next day is 16:47 the day before
    expect(mail.text).toMatch(/day of .*07:38.* to .*16:47/);
    expect(mail.text).toMatch(/Visit it/);
    expect(mail.text).toMatch(/local electrical codes/);
    expect(mail.html).toContain('Visit it');
  });
});


describe('the cause a mail gives fits its kind', () => {
  const base = { thresholds: { steady: 1.5, thin: 1 }, alertOnThin: false, maxVolts: MAX_VOLTS, night: null, day: null, missedDay: null };
  const draw = { measured_watts: 0.0021, modelled_watts: 0.002, draw_ratio: 1.05 };
  const mail = (kind: 'node_silent' | 'reserve_short', d: ReturnType<typeof alertDetail>) =>
    buildAlertMail({ kind, detail: d, nodeId: 3, nodeName: 'N-3', siteName: 'Weir', timeZone: 'UTC', appUrl: 'http://x' });

  it('a node silent while healthy points at the link or firmware, never at a small bank', () => {
    const silent = { ...alertDetail({ ...base, status: statusWith({ state: 'silent', margin: 17.9 }), measuredWatts: 0.0021 }), ...draw };
    const text = mail('node_silent', silent).text;
    expect(text).toMatch(/Likely cause: its bank was healthy .*17\.90×.*radio link/);
    expect(text).not.toMatch(/bank is too small/);
  });

  it('a short alert written after its projected brownout says it has passed', () => {
    const evaluated = new Date('2026-11-20T08:50:00Z');
    const late = alertDetail({ ...base, status: statusWith({ state: 'short', margin: 0.4, brownout_at: new Date('2026-11-20T06:36:00Z'), evaluated_at: evaluated }), measuredWatts: null });
    const m = mail('reserve_short', late);
    expect(m.subject).toContain('projected brownout at');
    expect(m.subject).toContain('has passed with no report since');
    expect(m.text).toContain('(passed, no report since)');
    const ahead = alertDetail({ ...base, status: statusWith({ state: 'short', margin: 0.4, brownout_at: new Date('2026-11-20T10:36:00Z'), evaluated_at: evaluated }), measuredWatts: null });
    expect(mail('reserve_short', ahead).subject).toContain('brownout projected');
  });
});
