import { useRef, useState } from 'react';
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
    if (!extraParsed.complete) return setProblem('Fill in every carton line, or remove the empty one.');
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
          <ScanBarcode className="h-5 w-5" aria-hidden /> Tracking number (scan the barcode or type it)
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
        {tracking && normaliseTrackingNumber(tracking) !== tracking && <span className="text-sm font-normal text-harbour-700">Recorded as {normaliseTrackingNumber(tracking)}</span>}
      </label>
      <label className="flex flex-col gap-1 font-bold" htmlFor="carrier">
        Carrier
        <input id="carrier" ref={carrierRef} value={carrier} onChange={(e) => setCarrier(e.target.value)} className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-3 text-base font-normal" />
      </label>

      {view.cartons.length > 0 && (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 font-bold">Packed cartons in this shipment</legend>
          {view.cartons.map((c) => (
            <CheckboxField
              key={c.id}
              label={`${c.count} × ${c.piecesPerCarton} pieces${c.weightKg != null ? `, ${c.weightKg} kg each` : ''}`}
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
            Add cartons not recorded at packing
          </Button>
        </div>
      )}

      <p className="text-lg font-bold" aria-live="polite">
        This shipment: {pieces} pieces of {q.availableToShip} finished and not yet shipped.
      </p>
      {pieces > q.availableToShip && (
        <p role="alert" className="font-bold text-stop-700">
          That is more than was made. Count the cartons again.
        </p>
      )}

      {q.needsDecision && (
        <div className="rounded-lg border-2 border-warn-700 bg-warn-50 p-3">
          <p className="flex items-start gap-2 font-bold text-warn-700">
            <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden /> Under quantity: {q.reachable} made or on the floor for {q.ordered} ordered ({q.shortBy} short).
          </p>
          <p className="mt-1 text-sm">Ship only when the customer agreed to take fewer pieces; otherwise make more first.</p>
          <CheckboxField label="The customer agreed: ship short" checked={acceptShort} onChange={(e) => setAcceptShort(e.target.checked)} />
          <label className="mt-1 flex flex-col gap-1 text-sm font-bold">
            Who agreed, and how
            <input value={note} onChange={(e) => setNote(e.target.value)} className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 text-base font-normal" />
          </label>
        </div>
      )}

      {problem && <ErrorPanel title="Check the shipment" message={problem} />}
      {duplicate ? (
        <div role="alert" className="rounded-lg border-2 border-warn-700 bg-warn-50 p-3">
          <p className="font-bold text-warn-700">Tracking number already on order {duplicate.join(', ')}.</p>
          <p className="mt-1 text-sm">Scan the parcel again to check. If these orders really travel in one parcel, record it anyway.</p>
          <Button className="mt-2" variant="secondary" onClick={() => submit(true)}>
            Record it anyway
          </Button>
        </div>
      ) : (
        ship.error && <ErrorPanel title="Not recorded" message={ship.error.message} />
      )}
      {done && (
        <div role="status" className="rounded-lg border-2 border-ok-700 bg-ok-50 p-3">
          <p className="font-bold text-ok-700">
            Shipment {done.number} recorded: {done.carrier} {done.trackingNumber}, {done.pieces} pieces.
          </p>
          <p className="text-sm">
            {done.mail.queued > 0 ? `Shipped mail queued (${done.mail.queued}).` : 'No shipped mail: nobody to send it to.'}
            {done.mail.missing.length > 0 && ` Missing: ${done.mail.missing.join(', ')}.`}
          </p>
          <a className="mt-1 inline-flex min-h-11 items-center gap-1 font-bold text-harbour-700 underline" href={packingListUrl(orderId, done.id)} target="_blank" rel="noreferrer">
            <FileText className="h-5 w-5" aria-hidden /> Packing list
          </a>
        </div>
      )}
      <div>
        <Button type="submit" size="lg" disabled={ship.isPending || pieces === 0 || pieces > q.availableToShip}>
          Record shipment
        </Button>
      </div>
    </form>
  );
}
