import { api } from '@/lib/api-client';
import type { SessionUserWire } from '@shared/schemas/auth';

export const badgeSignIn = (badge: string, pin: string) => api.post<{ user: SessionUserWire }>('/auth/badge', { badge, pin });
export const signOutSession = () => api.post<void>('/auth/logout');

/** The language the signed-in person chose for their account, when the server keeps one. */
export const fetchMyLocale = async (): Promise<unknown> => (await api.get<{ user: { locale?: unknown } }>('/auth/me')).user.locale;
/** Saves the person's language with their account (the tablet remembers it too, for offline). */
export const saveMyLocale = (locale: 'en' | 'zh-CN') => api.put<unknown>('/auth/me/locale', { locale });
