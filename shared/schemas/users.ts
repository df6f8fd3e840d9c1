import { z } from 'zod';
import { localeSchema, passwordSchema, roleSchema } from './auth';

export const pinSchema = z.string().regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits.');

export const createUserBody = z.strictObject({
  name: z.string().trim().min(1).max(120),
  email: z.email('Enter a valid e-mail address.').max(254),
  role: roleSchema,
  locale: localeSchema.optional(),
  password: passwordSchema,
  badge: z.string().trim().min(1).max(64).optional(),
  pin: pinSchema.optional(),
});
export type CreateUserBody = z.infer<typeof createUserBody>;

export const updateUserBody = z
  .strictObject({
    name: z.string().trim().min(1).max(120),
    role: roleSchema,
    locale: localeSchema,
    active: z.boolean(),
    badge: z.string().trim().min(1).max(64).nullable(),
    pin: pinSchema,
    password: passwordSchema,
  })
  .partial();
export type UpdateUserBody = z.infer<typeof updateUserBody>;

export const userView = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  locale: localeSchema,
  badge: z.string().nullable(),
  hasPin: z.boolean(),
  active: z.boolean(),
  lastLoginAt: z.string().nullable(),
});
export type UserView = z.infer<typeof userView>;
