import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import { Printer, RefreshCw } from 'lucide-react';
import { FLOOR_LEADS, OFFICE } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { trayPdfUrl, trayQueryOptions, useTray } from '@/features/trays/api/get-tray';
import { useReprint } from '@/features/trays/api/tray-actions';
import { EventsTable, Genealogy, MergeForm, RoutingProgress, SplitForm, useKindName } from '@/features/trays/components/tray-panels';
import { PhotosPanel } from '@/features/trays/components/photos-panel';
import { orderQueryOptions } from '@/features/orders/api/get-order';
import { ordersKeys } from '@/features/orders/api/orders-keys';
import { useMe } from '@/features/auth/api/get-me';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { formatDateTime, formatDueDay } from '@/lib/labels';

export const handle = { roles: OFFICE };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(trayQueryOptions(params.id!));

export function Component() {
  const { t: tr } = useTranslation('trays');
  const { t: tc } = useTranslation('common');
  const kindName = useKindName();
  const { id } = useParams();
  const tray = useTray(id!);
  const me = useMe();
  const qc = useQueryClient();
  const mayAct = !!me.data && FLOOR_LEADS.includes(me.data.user.role);
  const order = useQuery({ ...orderQueryOptions(tray.data?.orderId ?? ''), enabled: !!tray.data && mayAct });
  const refresh = () => qc.invalidateQueries({ queryKey: ordersKeys.all });
  const reprint = useReprint(refresh);
  if (tray.isPending) return <Loading />;
  if (tray.error) return <ErrorPanel message={tray.error.message} />;
  const t = tray.data;
  const candidates =
    order.data?.trays.filter((x) => x.id !== t.id && x.phase === 'waiting' && !x.onHold && x.stepSeq === t.nextStep?.seq && t.phase === 'waiting') ?? [];

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={tr(t.kind === 'mould' ? 'page.mouldTitle' : 'page.trayTitle', { number: t.number })}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <Link className="font-bold text-harbour-800 underline" to={paths.order(t.order.id)}>
              {tr('page.order', { number: t.order.number })}
            </Link>
            · {t.order.customer} · {t.order.title}
            <Pill tone={t.onHold ? 'stop' : t.phase === 'done' ? 'ok' : 'neutral'}>{tc(`phase.${t.status}`)}</Pill>
            <Pill>{tr('page.revision', { revision: t.revision })}</Pill>
          </span>
        }
        actions={
          mayAct &&
          t.phase !== 'merged' && (
            <>
              <a
                className="inline-flex min-h-11 items-center gap-2 rounded-lg bg-harbour-800 px-4 font-bold text-white hover:bg-harbour-700"
                href={trayPdfUrl(t.id)}
                download
              >
                <Printer className="h-5 w-5" aria-hidden /> {tr('page.print')}
              </a>
              <Button
                variant="secondary"
                disabled={reprint.isPending}
                onClick={() => {
                  if (window.confirm(tr('page.reprintConfirm', { number: t.number, revision: t.revision }))) reprint.mutate(t.id);
                }}
              >
                <RefreshCw className="h-5 w-5" aria-hidden /> {tr('page.reprint', { revision: t.revision })}
              </Button>
            </>
          )
        }
      />
      {reprint.error && <ErrorPanel title={tr('page.notReprinted')} message={reprint.error.message} />}
      <Card>
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[12rem_1fr]">
          <dt className="font-bold text-harbour-700">{tr('page.pieces')}</dt>
          <dd>{t.kind === 'mould' ? tr('page.aMould') : tr('page.piecesNow', { now: t.quantity, released: t.releasedQuantity })}</dd>
          <dt className="font-bold text-harbour-700">{tr('page.nextStep')}</dt>
          <dd>{t.nextStep ? `${t.nextStep.seq}. ${t.nextStep.name} (${kindName(t.nextStep.stationKind)})` : t.phase === 'done' ? tr('page.allDone') : '—'}</dd>
          {t.cureReadyAt && (
            <>
              <dt className="font-bold text-harbour-700">{tr('page.cureReadyAt')}</dt>
              <dd>{formatDateTime(t.cureReadyAt)}</dd>
            </>
          )}
          {t.onHold && (
            <>
              <dt className="font-bold text-harbour-700">{tr('page.onHold')}</dt>
              <dd>{t.holdReason ?? tr('page.noReason')}</dd>
            </>
          )}
          <dt className="font-bold text-harbour-700">{tr('page.released')}</dt>
          <dd>{formatDateTime(t.releasedAt)}</dd>
          <dt className="font-bold text-harbour-700">{tr('page.orderDue')}</dt>
          <dd>{formatDueDay(t.order.dueDate)}</dd>
          {t.mould && (
            <>
              <dt className="font-bold text-harbour-700">{tr('page.mould')}</dt>
              <dd>{tr('page.mouldSide', { side: tr(`page.side.${t.mould.side}`), number: t.mould.number })}</dd>
            </>
          )}
        </dl>
      </Card>
      <RoutingProgress tray={t} />
      <Genealogy tray={t} />
      {mayAct && t.kind === 'tray' && t.phase !== 'merged' && (
        <div className="grid gap-6 lg:grid-cols-2">
          <SplitForm tray={t} onChanged={refresh} />
          <MergeForm tray={t} candidates={candidates} onChanged={refresh} />
        </div>
      )}
      {mayAct && <PhotosPanel trayId={t.id} mayShare={me.data?.user.role === 'supervisor' || me.data?.user.role === 'admin'} />}
      <EventsTable tray={t} />
    </div>
  );
}
