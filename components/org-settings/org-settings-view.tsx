import type { OrgSettingsWire } from '@/lib/schemas/org-settings';

/** What deployers and viewers see: the same settings, read only. */
export function OrgSettingsView({ settings }: { settings: OrgSettingsWire }) {
  const rows: [string, string][] = [
    ['steady at or above', `${settings.steady_margin}×`],
    ['thin at or above (short below)', `${settings.thin_margin}×`],
    ['Alert when reserve turns thin', settings.alert_on_thin ? 'on' : 'off'],
    ['Re-send an open short alert after', `${settings.resend_short_hours} h`],
    ['At most e-mails per hour', String(settings.mail_cap_per_hour)],
  ];
  return (
    <dl className="max-w-xl divide-y divide-dusk-800 rounded-xl border border-dusk-700 bg-dusk-900" data-testid="org-settings-view">
      {rows.map(([term, value]) => (
        <div key={term} className="flex justify-between gap-4 px-4 py-3 text-sm">
          <dt className="text-ink-muted">{term}</dt>
          <dd className="figures font-bold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
