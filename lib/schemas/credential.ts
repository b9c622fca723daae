import { z } from 'zod';

/**
 * A new device credential as the form sends it and the API checks it. The label is how a
 * person tells live credentials apart when rotating, so it is required. 120 characters is
 * the `device_credentials.label` column.
 */
export const CREDENTIAL_LABEL_MAX = 120;

export const createCredentialBody = z.object({
  label: z.string({ error: (i) => (i.code === 'invalid_type' ? 'Give the credential a label.' : undefined) })
    .trim()
    .min(1, 'Give the credential a label, e.g. where it goes.')
    .max(CREDENTIAL_LABEL_MAX, `At most ${CREDENTIAL_LABEL_MAX} characters.`)
    .regex(/^[^\r\n]*$/, 'Use one line.'),
}).strict();

export type CreateCredentialBody = z.infer<typeof createCredentialBody>;
