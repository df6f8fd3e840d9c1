import { useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import { Lock, Rocket } from 'lucide-react';
import type { OrderDetail } from '@shared/schemas/orders';
import { MAX_TRAYS_PER_RELEASE, splitIntoTrays } from '@shared/domain/trays';
import { Card, ErrorPanel } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { CheckboxField, TextField } from '@/components/ui/field';
import { errorText } from '@/lib/error-text';
import { factoryLocalToIso, factoryTimeZone } from '@/lib/datetime';
import { DEFAULT_TIME_ZONE } from '@shared/domain/time-zone';
import { useReleaseOrder } from '../api/release-order';

/** Release to the floor: chooses the tray size; refuses (and says why) while a gate is open. */
export function ReleasePanel({ order }: { order: OrderDetail }) {
  const { t } = useTranslation('orders');
  const release = useReleaseOrder(order.id);
  const describeTrays = (total: number, size: number): string => {
    const trays = splitIntoTrays(total, size);
    const full = trays.filter((q) => q === size).length;
    const rest = trays.length - full;
    return rest
      ? t('release.traysRest', { count: trays.length, full, size, rest: trays[trays.length - 1] })
      : t('release.trays', { count: trays.length, full, size });
  };
  const [traySize, setTraySize] = useState(Math.min(100, order.releasedQuantity));
  const [onFloor, setOnFloor] = useState(false);
  const [releasedAt, setReleasedAt] = useState('');
  const sizeOk = Number.isInteger(traySize) && traySize >= 1;
  const tooMany = sizeOk && Math.ceil(order.releasedQuantity / traySize) > MAX_TRAYS_PER_RELEASE;
  const blocked = order.openGates.length > 0;
  const moulds = order.mouldPlan
    .map((m) => {
      const tool = t(`release.tool.${m.tool}`);
      if (m.reuse) return t('release.mouldReuse', { tool, number: m.mouldNumber });
      return t(m.tool === 'cutting_die' ? 'release.dieNew' : 'release.mouldNew', { tool });
    })
    .join(t('release.listJoin'));

  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <Rocket className="h-6 w-6" aria-hidden /> {t('release.title')}
      </h2>
      {blocked && (
        <div role="status" className="mb-4 flex items-start gap-3 rounded-lg border-2 border-warn-700/40 bg-warn-50 p-4">
          <Lock className="mt-0.5 h-5 w-5 shrink-0 text-warn-700" aria-hidden />
          <div>
            <p className="font-bold text-warn-700">{t('release.notReady')}</p>
            <ul className="list-disc pl-6">
              {order.openGates.map((g) => (
                <li key={g}>{t(`release.gate.${g}`)}</li>
              ))}
            </ul>
          </div>
        </div>
      )}
      <p className="mb-4">
        <Trans
          t={t}
          i18nKey="release.pieces"
          values={{ quantity: order.spec.quantity, overrun: order.spec.overrunPct, released: order.releasedQuantity, moulds }}
          components={{ strong: <strong /> }}
        />
      </p>
      <form
        aria-label={t('release.form')}
        className="flex flex-col gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          release.mutate({ traySize, ...(onFloor && releasedAt ? { releasedAt: factoryLocalToIso(releasedAt) } : {}) });
        }}
      >
        <div className="grid gap-4 md:grid-cols-3">
          <TextField
            label={t('release.traySize')}
            type="number"
            min={1}
            inputMode="numeric"
            value={Number.isNaN(traySize) ? '' : traySize}
            onChange={(e) => setTraySize(Math.round(Number(e.target.value)))}
            error={!sizeOk ? t('release.wholeNumber') : tooMany ? t('release.tooMany', { max: MAX_TRAYS_PER_RELEASE }) : undefined}
            hint={sizeOk ? describeTrays(order.releasedQuantity, traySize) : undefined}
          />
          <div className="flex flex-col gap-2">
            <CheckboxField label={t('release.onFloor')} checked={onFloor} onChange={(e) => setOnFloor(e.target.checked)} />
            {onFloor && (
              <TextField
                label={t('release.since')}
                type="datetime-local"
                value={releasedAt}
                onChange={(e) => setReleasedAt(e.target.value)}
                hint={t('release.sinceHint', { zone: factoryTimeZone() ?? DEFAULT_TIME_ZONE })}
              />
            )}
          </div>
        </div>
        <div>
          <Button type="submit" size="lg" disabled={release.isPending || !sizeOk || tooMany}>
            {t('release.submit', { number: order.number })}
          </Button>
        </div>
      </form>
      {release.error && (
        <div className="mt-4">
          <ErrorPanel title={t('release.notReleased')} message={errorText(release.error)} />
        </div>
      )}
    </Card>
  );
}
