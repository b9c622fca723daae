import { z } from 'zod';

/**
 * Organization settings, shared by PUT /api/v1/org/settings and its form (owner only):
 *   steady_margin       a node is `steady` at or above this night margin (DESIGN.md §4 default 1.5)
 *   thin_margin         `thin` at or above this, `short` below (default 1.0); steady > thin > 0
 *   alert_on_thin       also e-mail when a node turns thin (reserve_thin alerts)
 *   resend_short_hours  re-send an unacknowledged `short` alert after this many hours (1–168)
 *   mail_cap_per_hour   at most this many alert e-mails per hour for the organization (1–10000)
 */
const margin = (what: string) =>
  z.number({ message: `Enter the ${what} threshold as a number (a margin, e.g. 1.5).` }).finite().gt(0, 'Must be above 0.').max(100, 'Must be at most 100.');

export const orgSettingsBody = z
  .object({
    steady_margin: margin('steady'),
    thin_margin: margin('thin'),
    alert_on_thin: z.boolean({ message: 'Choose on or off.' }),
    resend_short_hours: z.number({ message: 'Enter whole hours.' }).int('Whole hours.').min(1, 'At least 1 h.').max(168, 'At most 168 h (a week).'),
    mail_cap_per_hour: z.number({ message: 'Enter a whole number of e-mails.' }).int('A whole number.').min(1, 'At least 1 e-mail an hour.').max(10_000, 'At most 10000 an hour.'),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.thin_margin >= v.steady_margin) {
      const detail = `The thin threshold (${v.thin_margin}) must be below the steady threshold (${v.steady_margin}).`;
      ctx.addIssue({ code: 'custom', path: ['thin_margin'], message: detail });
      ctx.addIssue({ code: 'custom', path: ['steady_margin'], message: `Must be above the thin threshold (${v.thin_margin}).` });
    }
  });

export type OrgSettings = z.infer<typeof orgSettingsBody>;

export interface OrgSettingsWire extends OrgSettings {
  name: string;
}
