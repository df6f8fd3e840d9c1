import { useTranslation } from 'react-i18next';
import { formatDateTime } from '@/lib/labels';
import { useProjections } from '../api/projections';
import { CoverageNote } from './coverage-note';

/** An open order's 85 % date, with what that promise has been measured to be worth. */
export function ProjectedP85({ orderId }: { orderId: string }) {
  const { t } = useTranslation('projections');
  const p = useProjections().data?.find((x) => x.orderId === orderId);
  if (!p?.p85At) return null;
  return (
    <span className="mt-1 block" data-testid="projected-p85">
      <span className="text-harbour-700">{t('whatIf.p85')}: </span>
      <span className="font-bold">{formatDateTime(p.p85At)}</span>
      <CoverageNote />
    </span>
  );
}
