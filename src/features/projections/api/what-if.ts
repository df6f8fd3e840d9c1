import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { WhatIfBodyInput, WhatIfResult } from '@shared/schemas/projections';

/** Asks the server to project an order that is not taken yet (nothing is stored). */
export function useWhatIf() {
  return useMutation({ mutationFn: (body: WhatIfBodyInput) => api.post<WhatIfResult>('/projections/what-if', body) });
}
