import { useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import { AlertTriangle, FileText, ScanBarcode } from 'lucide-react';
import { normaliseTrackingNumber } from '@shared/domain/shipping';
import { createShipmentSchema, type CreatedShipment, type CreateShipmentInput, type PackingView } from '@shared/schemas/shipping';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/field';
import { ErrorPanel } from '@/components/ui/panels';
import { ApiError } from '@/lib/api-client';
import { packingListUrl, useCreateShipment } from '../api/create-shipment';
import { CartonLinesEditor, parseCartons, type CartonDraft } from './carton-lines-editor';

const LAST_CARRIER = 'trayce.lastCarrier';

/**
 * At dispatch: the carrier and the tracking number (a hand scanner types it and presses Enter),
 * the packed cartons that go, and any cartons not recorded yet. Partial shipments are fine.
 */
export function ShipmentForm({ view }: { view: PackingView }) {
  const { t } = useTranslation('shipping');
  const orderId = view.order.id;
  const ship = useCreateShipment(orderId);
  const [carrier, setCarrier] = useState(() => localStorage.getItem(LAST_CARRIER) ?? '');
  const [tracking, setTracking] = useState('');
  // packed cartons go unless unticked (new ones packed meanwhile go too)
  const [left, setLeft] = useState<Set<string>>(() => new Set());
  const [extra, setExtra] = useState<CartonDraft[]>([]);
  const [acceptShort, setAcceptShort] = useState(false);
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<CreatedShipment | null>(null);
  const carrierRef = useRef<HTMLInputElement>(null);

  const extraParsed = parseCartons(extra);
  const pickedCartons = view.cartons.filter((c) => !left.has(c.id));
  const pieces = pickedCartons.reduce((a, c) => a + c.count * c.piecesPerCarton, 0) + extraParsed.totals.pieces;
  const q = view.quantities;
  const duplicate = ship.error instanceof ApiError && ship.error.code === 'duplicate_tracking' ? (ship.error.body.orders as string[]) : null;

  const body = (confirmDuplicate = false): CreateShipmentInput => ({
    carrier,
    trackingNumber: tracking,
    cartons: [...pickedCartons.map((c) => ({ cartonId: c.id })), ...extraParsed.valid],
    ...(q.needsDecision && acceptShort ? { acceptShort: true } : {}),
    ...(note.trim() ? { note: note.trim() } : {}),
    ...(confirmDuplicate ? { confirmDuplicate: true } : {}),
  });

  const submit = (confirmDuplicate = false) => {
    setProblem(null);
    const parsed = createShipmentSchema.safeParse(body(confirmDuplicate));
    if (!parsed.success) return setProblem(parsed.error.issues.map((i) => i.message).join(' '));
    if (!extraParsed.complete) return setProblem(t('ship.fillLines'));
    ship.mutate(body(confirmDuplicate), {
      onSuccess: (created) => {
        localStorage.setItem(LAST_CARRIER, carrier.trim());
        setDone(created);
        setTracking('');
        setExtra([]);
        setAcceptShort(false);
        setNote('');
      },
    });
  };

  return (
    <form
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <label className="flex flex-col gap-1 font-bold" htmlFor="tracking-number">
        <span className="flex items-center gap-2">
          <ScanBarcode className="h-5 w-5" aria-hidden /> {t('ship.tracking')}
        </span>
        <input
          id="tracking-number"
          autoFocus
          autoComplete="off"
          spellCheck={false}
          value={tracking}
          onChange={(e) => (setTracking(e.target.value), setDone(null), ship.reset())}
          onKeyDown={(e) => {
            // A hand scanner ends with Enter: go on to the carrier when it is still empty.
            if (e.key === 'Enter' && !carrier.trim()) {
              e.preventDefault();
              carrierRef.current?.focus();
            }
          }}
          className="min-h-14 rounded-lg border-2 border-harbour-100 bg-white px-3 font-mono text-2xl"
        />
        {tracking && normaliseTrackingNumber(tracking) !== tracking && (
          <span className="text-sm font-normal text-harbour-700">{t('ship.recordedAs', { value: normaliseTrackingNumber(tracking) })}</span>
        )}
      </label>
      <label className="flex flex-col gap-1 font-bold" htmlFor="carrier">
        {t('ship.carrier')}
        <input
          id="carrier"
          ref={carrierRef}
          value={carrier}
          onChange={(e) => setCarrier(e.target.value)}
          className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-3 text-base font-normal"
        />
      </label>

      {view.cartons.length > 0 && (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 font-bold">{t('ship.packedInShipment')}</legend>
          {view.cartons.map((c) => (
            <CheckboxField
              key={c.id}
              label={
                c.weightKg != null
                  ? t('pack.cartonLineKg', { count: c.count, per: c.piecesPerCarton, kg: c.weightKg })
                  : t('pack.cartonLine', { count: c.count, per: c.piecesPerCarton })
              }
              checked={!left.has(c.id)}
              onChange={(e) => {
                const next = new Set(left);
                if (e.target.checked) next.delete(c.id);
                else next.add(c.id);
                setLeft(next);
              }}
            />
          ))}
        </fieldset>
      )}
      {extra.length > 0 ? (
        <CartonLinesEditor idPrefix="ship" lines={extra} onChange={setExtra} />
      ) : (
        <div>
          <Button variant="ghost" onClick={() => setExtra([{ count: '1', piecesPerCarton: '', weightKg: '' }])}>
            {t('ship.addCartons')}
          </Button>
        </div>
      )}

      <p className="text-lg font-bold" aria-live="polite">
        {t('ship.thisShipment', { pieces, available: q.availableToShip })}
      </p>
      {pieces > q.availableToShip && (
        <p role="alert" className="font-bold text-stop-700">
          {t('ship.moreThanMade')}
        </p>
      )}

      {q.needsDecision && (
        <div className="rounded-lg border-2 border-warn-700 bg-warn-50 p-3">
          <p className="flex items-start gap-2 font-bold text-warn-700">
            <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden />{' '}
            {t('ship.under', { reachable: q.reachable, ordered: q.ordered, short: q.shortBy })}
          </p>
          <p className="mt-1 text-sm">{t('ship.underHow')}</p>
          <CheckboxField label={t('ship.acceptShort')} checked={acceptShort} onChange={(e) => setAcceptShort(e.target.checked)} />
          <label className="mt-1 flex flex-col gap-1 text-sm font-bold">
            {t('ship.whoAgreed')}
            <input
              value={note}
              onChange={(e) => setNote(e.target.value)}
              className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 text-base font-normal"
            />
          </label>
        </div>
      )}

      {problem && <ErrorPanel title={t('ship.check')} message={problem} />}
      {duplicate ? (
        <div role="alert" className="rounded-lg border-2 border-warn-700 bg-warn-50 p-3">
          <p className="font-bold text-warn-700">{t('ship.duplicate', { orders: duplicate.join(', ') })}</p>
          <p className="mt-1 text-sm">{t('ship.duplicateHow')}</p>
          <Button className="mt-2" variant="secondary" onClick={() => submit(true)}>
            {t('ship.anyway')}
          </Button>
        </div>
      ) : (
        ship.error && <ErrorPanel title={t('ship.notRecorded')} message={errorText(ship.error)} />
      )}
      {done && (
        <div role="status" className="rounded-lg border-2 border-ok-700 bg-ok-50 p-3">
          <p className="font-bold text-ok-700">
            {t('ship.done', { number: done.number, carrier: done.carrier, tracking: done.trackingNumber, pieces: done.pieces })}
          </p>
          <p className="text-sm">
            {done.mail.queued > 0 ? t('ship.mailQueued', { count: done.mail.queued }) : t('ship.noMail')}
            {done.mail.missing.length > 0 && t('ship.missing', { list: done.mail.missing.join(', ') })}
          </p>
          <a
            className="mt-1 inline-flex min-h-11 items-center gap-1 font-bold text-harbour-700 underline"
            href={packingListUrl(orderId, done.id)}
            target="_blank"
            rel="noreferrer"
          >
            <FileText className="h-5 w-5" aria-hidden /> {t('ship.packingList')}
          </a>
        </div>
      )}
      <div>
        <Button type="submit" size="lg" disabled={ship.isPending || pieces === 0 || pieces > q.availableToShip}>
          {t('ship.record')}
        </Button>
      </div>
    </form>
  );
}
