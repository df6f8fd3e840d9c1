import { useTranslation } from 'react-i18next';
import { Card } from '@/components/ui/panels';
import { formatDateTime } from '@/lib/labels';
import { useSharePhoto, useTrayPhotos } from '../api/tray-photos';
import { useKindName } from './tray-panels';

/**
 * The tray's QC photos. A supervisor chooses which the customer sees on her order page; none is
 * shown to her until then. Look for people, hands and other customers' work before sharing.
 */
export function PhotosPanel({ trayId, mayShare }: { trayId: string; mayShare: boolean }) {
  const { t } = useTranslation('trays');
  const kindName = useKindName();
  const photos = useTrayPhotos(trayId);
  const share = useSharePhoto(trayId);
  if (photos.isPending || !photos.data?.length) return null;
  return (
    <Card>
      <h2 className="text-xl font-bold text-harbour-900">{t('photos.title')}</h2>
      <p className="mt-1 text-harbour-700">{t('photos.intro')}</p>
      <ul className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        {photos.data.map((p) => (
          <li key={p.id} className="flex flex-col gap-2 rounded-lg border border-harbour-100 p-2">
            <img
              src={p.url}
              alt={
                p.stationKind
                  ? t('photos.altAt', { when: formatDateTime(p.takenAt), station: kindName(p.stationKind) })
                  : t('photos.alt', { when: formatDateTime(p.takenAt) })
              }
              className="aspect-square w-full rounded object-cover"
            />
            <p className="text-sm text-harbour-700">
              {formatDateTime(p.takenAt)}
              {p.stationKind ? ` · ${kindName(p.stationKind)}` : ''}
            </p>
            {mayShare ? (
              <label className="flex min-h-11 items-center gap-2 font-bold">
                <input
                  type="checkbox"
                  className="h-6 w-6"
                  checked={p.shareable}
                  disabled={share.isPending}
                  onChange={(e) => share.mutate({ id: p.id, shareable: e.target.checked })}
                />
                {t('photos.show')}
              </label>
            ) : (
              <p className="text-sm font-bold">{p.shareable ? t('photos.shown') : t('photos.notShown')}</p>
            )}
          </li>
        ))}
      </ul>
      {share.error && (
        <p role="alert" className="mt-2 font-bold text-stop-700">
          {share.error.message}
        </p>
      )}
    </Card>
  );
}
