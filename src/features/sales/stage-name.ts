// The server names an order's stage in English (CUSTOMER_STAGE_NAMES); screens show it in the
// reader's language through the portal's stage words.
import { useCallback } from 'react';
import { useTranslation } from 'react-i18next';
import { CUSTOMER_STAGE_NAMES, type CustomerStage } from '@shared/domain/stages';

const KEY_OF_NAME = new Map<string, CustomerStage | 'cancelled'>([
  ...(Object.entries(CUSTOMER_STAGE_NAMES) as [CustomerStage, string][]).map(([k, v]) => [v, k] as const),
  ['Cancelled', 'cancelled'],
]);

/** "Metal forming" → "金属成型" in Chinese; a name we do not know stays as it came. */
export function useStageName(): (name: string) => string {
  const { t } = useTranslation('portal');
  return useCallback(
    (name: string) => {
      const key = KEY_OF_NAME.get(name);
      return key ? t(`stages.${key}`) : name;
    },
    [t],
  );
}
