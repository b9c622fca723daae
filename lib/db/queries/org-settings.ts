import { db } from '../knex';
import { problems } from '../../errors';
import type { OrgSettings, OrgSettingsWire } from '../../schemas/org-settings';

/** State thresholds and e-mail limits of one organization. */
export async function getOrgSettings(orgId: number): Promise<OrgSettingsWire> {
  const row = await db()('organizations')
    .where({ id: orgId })
    .first('name', 'steady_margin', 'thin_margin', 'alert_on_thin', 'resend_short_hours', 'mail_cap_per_hour');
  if (!row) throw problems.notFound('The organization');
  return {
    name: row.name,
    steady_margin: Number(row.steady_margin),
    thin_margin: Number(row.thin_margin),
    alert_on_thin: Boolean(row.alert_on_thin),
    resend_short_hours: Number(row.resend_short_hours),
    mail_cap_per_hour: Number(row.mail_cap_per_hour),
  };
}

export async function updateOrgSettings(orgId: number, settings: OrgSettings): Promise<OrgSettingsWire> {
  await db()('organizations').where({ id: orgId }).update({
    steady_margin: settings.steady_margin,
    thin_margin: settings.thin_margin,
    alert_on_thin: settings.alert_on_thin,
    resend_short_hours: settings.resend_short_hours,
    mail_cap_per_hour: settings.mail_cap_per_hour,
  });
  return getOrgSettings(orgId);
}
