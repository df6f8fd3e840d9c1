import { z } from 'zod';
import { LOCALES, ROLES } from '../domain/vocabulary';

/** bcrypt reads at most 72 bytes; longer passwords are refused rather than silently cut. */
export const PASSWORD_MAX_BYTES = 72;
const utf8Length = (s: string) => new TextEncoder().encode(s).length;

export const passwordSchema = z
  .string()
  .min(8, 'Use at least 8 characters.')
  .refine((s) => utf8Length(s) <= PASSWORD_MAX_BYTES, {
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes (fewer characters if they are not plain letters).`,
    params: { code: 'password_too_long' },
  });

export const loginBody = z.strictObject({
  email: z.email('Enter an e-mail address.').max(254),
  password: z.string().min(1, 'Enter your password.').max(1024),
});
export type LoginBody = z.infer<typeof loginBody>;

export const badgeBody = z.strictObject({
  badge: z.string().trim().min(1).max(64),
  pin: z.string().regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits.'),
});
export type BadgeBody = z.infer<typeof badgeBody>;

export const roleSchema = z.enum(ROLES);

export const localeSchema = z.enum(LOCALES);

export const sessionUser = z.object({ id: z.string(), name: z.string(), role: roleSchema, locale: localeSchema, mustChangePassword: z.boolean().optional() });
export type SessionUserWire = z.infer<typeof sessionUser>;
export const meResponse = z.object({
  user: sessionUser,
  device: z
    .object({ id: z.string(), name: z.string(), kind: z.enum(['tablet', 'wall']), stationId: z.string().nullable() })
    .nullable()
    .optional(),
  /** the factory's time zone (IANA name): every time on screen is shown in it */
  timeZone: z.string().optional(),
});
export type MeResponse = z.infer<typeof meResponse>;

/** A person choosing the language they read the app in. */
export const localeBody = z.strictObject({ locale: localeSchema });
export type LocaleBody = z.infer<typeof localeBody>;

/** A person changing their own password (required first when the account has the default one). */
export const changePasswordBody = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password.').max(1024),
  newPassword: passwordSchema,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;
