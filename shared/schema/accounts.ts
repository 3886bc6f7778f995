/** Account and farm request bodies, shared by the client forms and the API. */
import { z } from 'zod';

export const emailSchema = z
  .string({ error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address' }).max(254, 'E-mail is too long'));

export const passwordSchema = z
  .string({ error: 'Password is required' })
  .min(10, 'Password must be at least 10 characters')
  .max(200, 'Password must be at most 200 characters');

export const personNameSchema = z
  .string({ error: 'Name is required' })
  .trim()
  .min(1, 'Name is required')
  .max(120, 'Name must be at most 120 characters');

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required').max(200),
});

/** True when the password is the e-mail address (ignoring case and surrounding spaces). */
export function passwordIsEmail(password: string, email: string): boolean {
  return password.trim().toLowerCase() === email.trim().toLowerCase();
}

export const PASSWORD_IS_EMAIL = 'Password must not be your e-mail address';

export const signUpSchema = z
  .object({ name: personNameSchema, email: emailSchema, password: passwordSchema })
  .refine((v) => !passwordIsEmail(v.password, v.email), { path: ['password'], message: PASSWORD_IS_EMAIL });

export const farmRoleSchema = z.enum(['owner', 'partner', 'consultant', 'lender'], {
  error: 'Role must be owner, partner, consultant or lender',
});

export const createFarmSchema = z.object({
  name: z.string({ error: 'Farm name is required' }).trim().min(1, 'Farm name is required').max(120),
  location: z.string().trim().max(160, 'Location must be at most 160 characters').default(''),
  currency: z
    .string()
    .regex(/^[A-Z]{3}$/, 'Currency must be a three-letter ISO code such as EUR')
    .default('EUR'),
  locale: z.string().min(2).max(35).default('en-IE'),
  units: z.enum(['metric', 'us'], { error: 'Units must be metric or us' }).default('metric'),
});

/** Opaque e-mailed token (invitation or password reset), base64url. */
export const emailTokenSchema = z
  .string({ error: 'The link is incomplete' })
  .regex(/^[A-Za-z0-9_-]{20,100}$/, 'The link is incomplete or damaged');

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetSchema = z.object({ token: emailTokenSchema, password: passwordSchema });

export const inviteSchema = z.object({ email: emailSchema, role: farmRoleSchema });

export const changeRoleSchema = z.object({ role: farmRoleSchema });

/** Accepting an invitation without an account: the new account's name and password. */
export const acceptInvitationSchema = z.object({
  name: personNameSchema.optional(),
  password: passwordSchema.optional(),
});

export const updateProfileSchema = z.object({ name: personNameSchema });

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: 'Current password is required' }).min(1, 'Current password is required').max(200),
  newPassword: passwordSchema,
});

export const adminUpdateUserSchema = z.object({ disabled: z.boolean({ error: 'disabled must be true or false' }) });

export type SignInInput = z.infer<typeof signInSchema>;
export type SignUpInput = z.infer<typeof signUpSchema>;
export type CreateFarmInput = z.infer<typeof createFarmSchema>;
export type FarmRole = z.infer<typeof farmRoleSchema>;
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;
export type PasswordResetInput = z.infer<typeof passwordResetSchema>;
export type InviteInput = z.infer<typeof inviteSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type UpdateProfileInput = z.infer<typeof updateProfileSchema>;
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
