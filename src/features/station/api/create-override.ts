import { api } from '@/lib/api-client';
import type { OverrideBody, OverrideView } from '@shared/schemas/scans';

export const createOverride = (body: OverrideBody) => api.post<OverrideView>('/scans/overrides', body);
