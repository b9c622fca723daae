import { describe, expect, it } from 'vitest';
import { chooseRecipients, deliveryFor, type MemberContact, type SubscriptionRow } from '@/lib/alerts/recipients';

const owner: MemberContact = { membershipId: 1, role: 'owner', email: 'o@test.example', name: 'O' };
const deployer: MemberContact = { membershipId: 2, role: 'deployer', email: 'd@test.example', name: 'D' };
const viewer: MemberContact = { membershipId: 3, role: 'viewer', email: 'v@test.example', name: 'V' };

describe('recipients (issue 6: per site and kind, immediate or digest; owners get short, dark, silent and over-voltage by default)', () => {
  it('an owner with no rows gets short, dark, silent and over-voltage alerts immediately and nothing else; others get nothing by default', () => {
    expect(deliveryFor({ member: owner, subscriptions: [], siteId: 5, kind: 'reserve_short' })).toBe('immediate');
    expect(deliveryFor({ member: owner, subscriptions: [], siteId: 5, kind: 'over_voltage' })).toBe('immediate');
    expect(deliveryFor({ member: owner, subscriptions: [], siteId: 5, kind: 'node_dark' })).toBe('immediate');
    expect(deliveryFor({ member: owner, subscriptions: [], siteId: 5, kind: 'node_silent' })).toBe('immediate');
    expect(deliveryFor({ member: owner, subscriptions: [], siteId: 5, kind: 'draw_anomaly' })).toBeNull();
    expect(deliveryFor({ member: deployer, subscriptions: [], siteId: 5, kind: 'reserve_short' })).toBeNull();
  });

  it('a site row wins over the every-site row; an empty kinds list mutes', () => {
    const subs: SubscriptionRow[] = [
      { membershipId: 2, siteId: null, kinds: ['reserve_short', 'node_dark'], delivery: 'immediate' },
      { membershipId: 2, siteId: 7, kinds: ['node_dark'], delivery: 'digest' },
      { membershipId: 1, siteId: null, kinds: [], delivery: 'immediate' },
    ];
    expect(deliveryFor({ member: deployer, subscriptions: subs, siteId: 5, kind: 'reserve_short' })).toBe('immediate');
    expect(deliveryFor({ member: deployer, subscriptions: subs, siteId: 7, kind: 'reserve_short' })).toBeNull();
    expect(deliveryFor({ member: deployer, subscriptions: subs, siteId: 7, kind: 'node_dark' })).toBe('digest');
    expect(deliveryFor({ member: owner, subscriptions: subs, siteId: 5, kind: 'reserve_short' })).toBeNull(); // the owner opted out
    const immediate = chooseRecipients({ members: [owner, deployer, viewer], subscriptions: subs, siteId: 5, kind: 'node_dark', delivery: 'immediate' });
    expect(immediate.map((m) => m.email)).toEqual(['d@test.example']);
  });
});
