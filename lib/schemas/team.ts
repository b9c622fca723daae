import { z } from 'zod';
import { passwordSchema } from '../auth/password';
import { ROLES } from '../auth/roles';

// Shared by the team forms and their route handlers: the form shows the server's words.
export const roleSchema = z.enum(ROLES, { message: 'Choose owner, deployer or viewer.' });
export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(254);

/** A one-time link's token (lib/auth/one-time-token.ts writes 43 base64url characters). */
export const oneTimeTokenSchema = z.string().min(20).max(200).regex(/^[A-Za-z0-9_-]+$/, 'Not a valid link.');

export const changeRoleBody = z.object({ role: roleSchema }).strict();
export const inviteBody = z.object({ email: emailSchema, role: roleSchema }).strict();
// name and password are needed only when the invitation creates the account (the server says which).
export const acceptInvitationBody = z.object({
  token: oneTimeTokenSchema,
  name: z.string().trim().min(1, 'Enter your name.').max(200).regex(/^[^\r\n]*$/, 'Use one line.').optional(),
  password: passwordSchema.optional(),
}).strict();
export const resetRequestBody = z.object({ email: emailSchema }).strict();
export const resetConfirmBody = z.object({ token: oneTimeTokenSchema, password: passwordSchema }).strict();
