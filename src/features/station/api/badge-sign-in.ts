import { api } from '@/lib/api-client';
import type { SessionUserWire } from '@shared/schemas/auth';

export const badgeSignIn = (badge: string, pin: string) => api.post<{ user: SessionUserWire }>('/auth/badge', { badge, pin });
export const signOutSession = () => api.post<void>('/auth/logout');
