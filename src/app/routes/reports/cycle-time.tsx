import { useTranslation } from 'react-i18next';
import { REPORT_READERS } from '@shared/domain/access';
import type { StationKind } from '@shared/domain/vocabulary';
import type { Summary } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars } from '@/features/reports/components/charts';
import { useStations } from '@/features/stations/api/get-stations';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
import { hoursText, percentText } from '@/lib/duration';

export const handle = { roles: REPORT_READERS };

const stats = ['p50', 'p85', 'mean'] as const;
const cells = (s: Summary) => stats.map((k) => s[k] ?? '–');

export function Component() {
  const { t } = useTranslation('reports');
  const { filters, report, frame } = useReportPage('cycle-time', { station: true });
  const stations = useStations();
  const r = report.data;
  const kindName = (k: string) => t(`station:kind.${k as StationKind}`, { defaultValue: humanise(k) });
  const head = [
    t('cycleTime.col.kind'),
    t('cycleTime.col.processN'),
    ...stats.map((stat) => t('cycleTime.col.processClock', { stat: t(`cycleTime.stat.${stat}`) })),
    ...stats.map((stat) => t('cycleTime.col.processWorking', { stat: t(`cycleTime.stat.${stat}`) })),
    t('cycleTime.col.queueN'),
    ...stats.map((stat) => t('cycleTime.col.queueClock', { stat: t(`cycleTime.stat.${stat}`) })),
    ...stats.map((stat) => t('cycleTime.col.queueWorking', { stat: t(`cycleTime.stat.${stat}`) })),
  ];
  const fe = r?.flowEfficiency;
  return (
    <ReportFrame {...frame} percentiles stations={stations.data ?? []} note={t('cycleTime.note')}>
      {report.isPending ? (
        <Loading label={t('cycleTime.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r && fe ? (
        <>
          <Card>
            <h2 className="text-xl font-bold text-harbour-900">{t('cycleTime.flowTitle')}</h2>
            {fe.trays === 0 ? (
              <p className="text-harbour-700">{filters.stationId ? t('cycleTime.noTrayStation') : t('cycleTime.noTray')}</p>
            ) : (
              <>
                <p className="mt-1 text-lg">
                  <strong className="text-3xl">{percentText(fe.working.flowEfficiency)}</strong>{' '}
                  {t('cycleTime.headline', {
                    process: hoursText(fe.working.processMinutes / 60),
                    flow: hoursText(fe.working.flowMinutes / 60),
                    trays: fe.trays.toLocaleString(),
                  })}
                </p>
                <p className="mt-1">
                  {t('cycleTime.calendar', {
                    process: hoursText(fe.calendar.processMinutes / 60),
                    flow: hoursText(fe.calendar.flowMinutes / 60),
                    share: percentText(fe.calendar.flowEfficiency),
                  })}
                </p>
                <p className="mt-1">{t('cycleTime.cure', { working: percentText(fe.working.cureShare), calendar: percentText(fe.calendar.cureShare) })}</p>
              </>
            )}
          </Card>
          <ChartAndTable
            title={t('cycleTime.chartTitle')}
            caption={t('cycleTime.chartCaption')}
            bars={r.stations.length}
            chart={
              <Bars
                layout="vertical"
                data={r.stations.map((s) => ({ kind: kindName(s.stationKind), queue: s.queueWorking.p50, process: s.processWorking.p50 }))}
                x="kind"
                yLabel={t('cycleTime.axis')}
                series={[
                  { key: 'queue', name: t('cycleTime.queueP50') },
                  { key: 'process', name: t('cycleTime.processP50') },
                ]}
              />
            }
            table={
              <StatTable
                label={t('cycleTime.table')}
                head={head}
                rows={r.stations.map((s) => [
                  kindName(s.stationKind),
                  s.process.n,
                  ...cells(s.process),
                  ...cells(s.processWorking),
                  s.queue.n,
                  ...cells(s.queue),
                  ...cells(s.queueWorking),
                ])}
              />
            }
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
