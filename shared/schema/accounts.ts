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

export const signUpSchema = z
  .object({ name: personNameSchema, email: emailSchema, password: passwordSchema })
  .refine((v) => v.password.trim().toLowerCase() !== v.email, {
    path: ['password'],
    message: 'Password must not be your e-mail address',
  });

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

export type SignInInput = z.infer<typeof signInSchema>;
export type SignUpInput = z.infer<typeof signUpSchema>;
export type CreateFarmInput = z.infer<typeof createFarmSchema>;
export type FarmRole = z.infer<typeof farmRoleSchema>;
