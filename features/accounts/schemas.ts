import { z } from 'zod';
import { hasControlCharacters } from '@/features/ui/bounded';
import { knownTimeZone } from '@/features/ui/time-zone-names';

const noControl = { error: 'Remove the control character (such as a NUL byte) from this field.' };

export const emailField = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }).max(254));

// NIST SP 800-63B: length over composition rules; 12 is a common floor for new passwords.
export const newPasswordField = z
  .string({ error: 'Choose a password.' })
  .min(12, { error: 'Use at least 12 characters.' })
  .max(128, { error: 'Use at most 128 characters.' });

export const personName = z
  .string({ error: 'Enter a name.' })
  .trim()
  .min(1, { error: 'Enter a name.' })
  .max(80, { error: 'Keep the name under 80 characters.' })
  .refine((s) => !hasControlCharacters(s), noControl);

export const signUpSchema = z.object({
  shopName: z
    .string({ error: 'Enter the shop name.' })
    .trim()
    .min(2, { error: 'Enter the shop name (at least 2 characters).' })
    .max(80, { error: 'Keep the shop name under 80 characters.' })
    .refine((s) => !hasControlCharacters(s), noControl),
  name: personName,
  email: emailField,
  password: newPasswordField,
  /** The browser's own zone, filled in by the form; anything unknown (or missing) leaves the shop on UTC. */
  timeZone: z.preprocess((v) => knownTimeZone(v) ?? undefined, z.string().optional()),
});

export const signInSchema = z.object({
  email: emailField,
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, { error: 'Enter your password.' })
    .max(128),
  /** Where the person was before their session ended (checked again before use). */
  next: z
    .string()
    .max(300)
    .refine((s) => !hasControlCharacters(s), noControl)
    .optional(),
});

export type SignUpInput = z.infer<typeof signUpSchema>;

export const confirmSignUpSchema = z.object({ token: z.string().min(20).max(200) });
export type SignInInput = z.infer<typeof signInSchema>;

export const roleField = z.enum(['lead', 'technician', 'apprentice'], {
  error: 'Choose a role: lead, technician or apprentice.',
});

export const memberIdField = z.uuid({ error: 'Unknown team member.' });

export const inviteSchema = z.object({ email: emailField, role: roleField });
export const changeRoleSchema = z.object({ memberId: memberIdField, role: roleField });
export const removeMemberSchema = z.object({ memberId: memberIdField });
export const revokeInviteSchema = z.object({ inviteId: z.uuid({ error: 'Unknown invite.' }) });
export const acceptInviteSchema = z.object({
  token: z
    .string()
    .min(20)
    .max(200)
    .refine((s) => !hasControlCharacters(s), noControl),
  name: personName,
  password: newPasswordField,
});

export type InviteInput = z.infer<typeof inviteSchema>;
export type AcceptInviteInput = z.infer<typeof acceptInviteSchema>;
