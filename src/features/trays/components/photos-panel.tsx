import { Card } from '@/components/ui/panels';
import { formatDateTime, humanise } from '@/lib/labels';
import { useSharePhoto, useTrayPhotos } from '../api/tray-photos';

/**
 * The tray's QC photos. A supervisor chooses which the customer sees on her order page; none is
 * shown to her until then. Look for people, hands and other customers' work before sharing.
 */
export function PhotosPanel({ trayId, mayShare }: { trayId: string; mayShare: boolean }) {
  const photos = useTrayPhotos(trayId);
  const share = useSharePhoto(trayId);
  if (photos.isPending || !photos.data?.length) return null;
  return (
    <Card>
      <h2 className="text-xl font-bold text-harbour-900">QC photos</h2>
      <p className="mt-1 text-harbour-700">A photo shown to the customer appears with her order&apos;s production story. Share only photos of this order&apos;s pieces, with no people in them.</p>
      <ul className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        {photos.data.map((p) => (
          <li key={p.id} className="flex flex-col gap-2 rounded-lg border border-harbour-100 p-2">
            <img src={p.url} alt={`QC photo taken ${formatDateTime(p.takenAt)}${p.stationKind ? ` at ${humanise(p.stationKind)}` : ''}`} className="aspect-square w-full rounded object-cover" />
            <p className="text-sm text-harbour-700">
              {formatDateTime(p.takenAt)}
              {p.stationKind ? ` · ${humanise(p.stationKind)}` : ''}
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
                Show to the customer
              </label>
            ) : (
              <p className="text-sm font-bold">{p.shareable ? 'Shown to the customer' : 'Not shown to the customer'}</p>
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
