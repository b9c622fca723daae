import { describe, expect, it } from 'vitest';
import { ROLE_SENTENCE } from '@/lib/auth/role-words';
import { PERMISSIONS, ROLES } from '@/lib/auth/roles';
import { buildInvitationMail, type InvitationMailInput } from '@/lib/mail/templates/invitation-mail';

// An invented organization and people (no real ones).
const base: InvitationMailInput = {
  orgName: 'Fernbrook Test Trust',
  role: 'deployer',
  inviter: { name: 'Oda Testowner', email: 'oda@fernbrook.example' },
  link: 'http://127.0.0.1:3000/invitations/abc123',
  expiresAt: new Date('2026-12-10T14:05:00Z'),
  validDays: 7,
  existingAccount: false,
};

describe('the invitation e-mail', () => {
  it('names who invites, the organization, the role offered and what it may do', () => {
    const mail = buildInvitationMail(base);
    expect(mail.subject).toBe('Oda Testowner invited you to Fernbrook Test Trust on Duskwatch');
    expect(mail.text).toMatch(/Invited by:\s+Oda Testowner \(oda@fernbrook\.example\)/);
    expect(mail.text).toMatch(/Organization:\s+Fernbrook Test Trust/);
    expect(mail.text).toMatch(/Role offered:\s+deployer/);
    expect(mail.text).toContain(ROLE_SENTENCE.deployer);
    expect(mail.html).toContain(ROLE_SENTENCE.deployer);
    expect(mail.html).toContain('oda@fernbrook.example');
  });

  it('says when the link expires (in UTC, as the team screen does) and that it works once', () => {
    const mail = buildInvitationMail(base);
    // 2026-12-10 is a Thursday (common practice: any calendar).
    expect(mail.text).toMatch(/Link expires:\s+10 Dec 2026 14:05 UTC \(7 days after it was sent; it works once\)/);
    expect(mail.html).toContain('10 Dec 2026 14:05 UTC');
  });

  it('tells someone who was not expecting it to ignore it', () => {
    const mail = buildInvitationMail(base);
    expect(mail.text).toMatch(/If you weren't expecting this invitation, ignore this e-mail/);
    expect(mail.html).toMatch(/If you weren&#39;t expecting this invitation, ignore this e-mail/);
  });

  it('asks a new person to set a password and tells an existing account it keeps its own', () => {
    const fresh = buildInvitationMail(base);
    expect(fresh.text).toContain('Set your password here:\nhttp://127.0.0.1:3000/invitations/abc123');
    expect(fresh.text).not.toContain('keep your present password');
    const known = buildInvitationMail({ ...base, existingAccount: true });
    expect(known.text).toContain('Accept the invitation here:\nhttp://127.0.0.1:3000/invitations/abc123');
    expect(known.text).toContain('You keep your present password');
    expect(known.html).toContain('href="http://127.0.0.1:3000/invitations/abc123"');
  });

  it('gives each role its own sentence', () => {
    for (const role of ROLES) {
      const mail = buildInvitationMail({ ...base, role });
      expect(mail.text).toMatch(new RegExp(`Role offered:\\s+${role}\\n`));
      expect(mail.text).toContain(ROLE_SENTENCE[role]);
      for (const other of ROLES.filter((r) => r !== role)) expect(mail.text).not.toContain(ROLE_SENTENCE[other]);
    }
  });

  it('falls back to the address when the inviter has no display name', () => {
    const mail = buildInvitationMail({ ...base, inviter: { name: '', email: 'oda@fernbrook.example' } });
    expect(mail.subject).toBe('oda@fernbrook.example invited you to Fernbrook Test Trust on Duskwatch');
    expect(mail.text).toMatch(/Invited by:\s+oda@fernbrook\.example\n/);
  });

  it('keeps names with line breaks on one subject line and escapes them in HTML', () => {
    const mail = buildInvitationMail({ ...base, orgName: 'Trust<b>\r\nBcc: x@test.example', inviter: { name: 'Oda\r\nX-Injected: 1', email: 'oda@fernbrook.example' } });
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.html).not.toContain('<b>');
    expect(mail.html).toContain('Trust&lt;b&gt;');
    expect(mail.text.split('\n').some((l) => l.startsWith('Bcc:') || l.startsWith('X-Injected:'))).toBe(false);
  });
});

describe('the role sentences', () => {
  it('name what PERMISSIONS gives each role (lib/auth/roles.ts)', () => {
    // Every capability a deployer gains over a viewer is named in the deployer sentence.
    const deployerWords: Record<string, RegExp> = {
      'sites:write': /sites/, 'nodes:write': /nodes/, 'credentials:manage': /device credentials/, 'imports:create': /imports/,
      'bench:write': /bench logs/, 'visits:write': /field visits/, 'alerts:acknowledge': /acknowledges alerts/,
    };
    const deployerOnly = Object.entries(PERMISSIONS).filter(([, r]) => r === 'deployer').map(([p]) => p);
    expect(deployerOnly.sort()).toEqual(Object.keys(deployerWords).sort());
    for (const p of deployerOnly) expect(ROLE_SENTENCE.deployer).toMatch(deployerWords[p]!);
    const ownerOnly = Object.entries(PERMISSIONS).filter(([, r]) => r === 'owner').map(([p]) => p);
    expect(ownerOnly.sort()).toEqual(['org:settings', 'team:manage']);
    expect(ROLE_SENTENCE.owner).toMatch(/inviting and removing people, changing roles and the organization settings/);
    expect(ROLE_SENTENCE.viewer).toMatch(/changes nothing/);
  });
});
