import { useParams } from 'react-router';
import { Loader2, PackageCheck, Truck } from 'lucide-react';
import { usePublicStatus } from '@/features/customer-status/api/get-public-status';
import { StageLine } from '@/components/ui/stage-line';
import { ApiError } from '@/lib/api-client';

// The page a customer opens from the link sales sent: one order, read-only, made for a phone.
// It shows only what the public status answer holds; no sign-in, no navigation into the app.

function longDate(iso: string): string {
  return new Date(iso).toLocaleDateString(undefined, { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' });
}

function Frame({ children }: { children: React.ReactNode }) {
  return (
    <div className="min-h-full bg-paper">
      <title>Order status</title>
      <meta name="robots" content="noindex, nofollow" />
      <meta name="referrer" content="no-referrer" />
      <main className="mx-auto flex w-full max-w-md flex-col gap-5 px-4 py-6">{children}</main>
    </div>
  );
}

export function Component() {
  const { token = '' } = useParams();
  const status = usePublicStatus(token);

  if (status.isPending) {
    return (
      <Frame>
        <p role="status" className="flex items-center gap-2 text-harbour-700">
          <Loader2 className="h-5 w-5 animate-spin" aria-hidden /> Loading the order status…
        </p>
      </Frame>
    );
  }
  if (status.error) {
    const e = status.error;
    const gone = e instanceof ApiError && e.status === 404;
    const busy = e instanceof ApiError && e.status === 429;
    return (
      <Frame>
        <div role="alert" className="rounded-xl border-2 border-harbour-100 bg-white p-5">
          <h1 className="text-2xl font-bold text-harbour-900">{gone ? 'This link does not work any more' : busy ? 'Please wait a minute' : 'The status cannot be shown right now'}</h1>
          <p className="mt-2 text-ink">
            {gone
              ? 'The order status link may have been withdrawn or mistyped. Ask your contact at the factory for a new one.'
              : busy
                ? 'This page was opened many times in a short while. Reload it in a minute.'
                : 'Check your connection and reload the page.'}
          </p>
        </div>
      </Frame>
    );
  }
  const s = status.data;
  const shipped = !!s.shippedAt;
  return (
    <Frame>
      <header className="rounded-xl bg-harbour-800 p-5 text-white">
        <p className="text-sm font-bold uppercase tracking-wide text-brass-300">Order status</p>
        <h1 className="mt-1 text-2xl font-bold leading-tight">{s.title}</h1>
        <p className="mt-1 text-lg">{s.customer}</p>
      </header>

      <section aria-labelledby="when" className="rounded-xl border border-harbour-100 bg-white p-5">
        <h2 id="when" className="flex items-center gap-2 text-lg font-bold text-harbour-900">
          {shipped ? <PackageCheck className="h-6 w-6" aria-hidden /> : <Truck className="h-6 w-6" aria-hidden />}
          {shipped ? 'Shipped' : 'Expected to ship'}
        </h2>
        <p className="mt-1 text-2xl font-bold text-ink" data-testid="ship-date">
          {shipped ? longDate(s.shippedAt!) : s.projectedShipAt ? longDate(s.projectedShipAt) : 'A date follows once production starts'}
        </p>
        {!shipped && s.projectedShipAt && <p className="mt-1 text-sm text-harbour-700">Our current projection from the work still to do; it can move.</p>}
        {s.carrier && s.trackingNumber && (
          <dl className="mt-4 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="text-harbour-700">Carrier</dt>
            <dd className="font-bold">{s.carrier}</dd>
            <dt className="text-harbour-700">Tracking number</dt>
            <dd className="break-all font-mono text-lg font-bold">{s.trackingNumber}</dd>
          </dl>
        )}
      </section>

      <section aria-labelledby="stage" className="rounded-xl border border-harbour-100 bg-white p-5">
        <h2 id="stage" className="text-lg font-bold text-harbour-900">
          Now: <span data-testid="stage">{s.stage}</span>
        </h2>
        <div className="mt-3">
          <StageLine stages={s.stages} current={s.stage} />
        </div>
      </section>
    </Frame>
  );
}
