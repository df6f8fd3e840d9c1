import { useTranslation } from 'react-i18next';
import { REPORT_READERS } from '@shared/domain/access';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars, CumulativeFlow, Lines } from '@/features/reports/components/charts';
import { ErrorPanel, Loading } from '@/components/ui/panels';

export const handle = { roles: REPORT_READERS };

export function Component() {
  const { t } = useTranslation('reports');
  const { filters, report, frame } = useReportPage('flow', { bucket: true });
  const STAGES = ['released', 'started', 'inspected', 'packed', 'shipped'] as const;
  const stageName = (s: string) => ((STAGES as readonly string[]).includes(s) ? t(`flow.stage.${s as (typeof STAGES)[number]}`) : s);
  const r = report.data;
  const per = filters.bucket === 'week' ? 'week' : 'day';
  return (
    <ReportFrame {...frame} note={t('flow.note')}>
      {report.isPending ? (
        <Loading label={t('flow.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <ChartAndTable
            title={t('flow.cumulative')}
            caption={t('flow.cumulativeCaption')}
            chart={
              <CumulativeFlow
                data={r.buckets.map((b) => ({ label: b.label, ...Object.fromEntries(r.stages.map((s, i) => [s, b.cumulative[i]])) }))}
                stages={r.stages.map((s) => ({ key: s, name: stageName(s) }))}
              />
            }
            table={
              <StatTable
                label={t('flow.cumulativeTable')}
                head={[per === 'week' ? t('flow.weekOf') : t('flow.day'), ...r.stages.map(stageName)]}
                rows={r.buckets.map((b) => [b.label, ...b.cumulative])}
              />
            }
          />
          <ChartAndTable
            title={per === 'week' ? t('flow.throughputWeek') : t('flow.throughputDay')}
            caption={t('flow.throughputCaption')}
            chart={
              <Bars
                data={r.buckets}
                x="label"
                yLabel={t('chart.trays')}
                series={[
                  { key: 'trays', name: t('flow.traysShipped') },
                  { key: 'orders', name: t('flow.ordersShipped') },
                ]}
              />
            }
            table={
              <StatTable
                label={t('flow.throughputTable')}
                head={[per === 'week' ? t('flow.weekOf') : t('flow.day'), t('flow.trays'), t('flow.pieces'), t('flow.orders')]}
                rows={r.buckets.map((b) => [b.label, b.trays, b.pieces, b.orders])}
              />
            }
          />
          <ChartAndTable
            title={t('flow.wip')}
            caption={t('flow.wipCaption')}
            chart={
              <Lines
                data={r.buckets}
                x="label"
                yLabel={t('chart.trays')}
                series={[
                  { key: 'wipAverage', name: t('flow.average') },
                  { key: 'wipAtEnd', name: t('flow.atEnd') },
                ]}
              />
            }
            table={
              <StatTable
                label={t('flow.wipTable')}
                head={[per === 'week' ? t('flow.weekOf') : t('flow.day'), t('flow.average'), t('flow.atEnd')]}
                rows={r.buckets.map((b) => [b.label, b.wipAverage, b.wipAtEnd])}
              />
            }
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
