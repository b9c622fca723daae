import { z } from 'zod';

/** PUT /api/v1/org/current: which of the caller's organizations the app shows from now on. */
export const currentOrgBody = z.object({
  org_id: z.number({ message: 'Choose one of your organizations.' }).int('Choose one of your organizations.').positive('Choose one of your organizations.'),
}).strict();
