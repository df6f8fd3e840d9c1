import { useTranslation } from 'react-i18next';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars } from '@/features/reports/components/charts';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { percentText } from '@/lib/duration';
import { WITH_SALES } from './layout';

export const handle = { roles: WITH_SALES };

export function Component() {
  const { t } = useTranslation('reports');
  const { filters, report, frame } = useReportPage('on-time', { bucket: true });
  const r = report.data;
  return (
    <ReportFrame {...frame} note={t('onTime.note')}>
      {report.isPending ? (
        <Loading label={t('onTime.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <Card>
            <p className="text-lg">
              <strong className="text-3xl">{percentText(r.total.share)}</strong>{' '}
              {t('onTime.headline', { onTime: r.total.onTime.toLocaleString('en-GB'), shipped: r.total.shipped.toLocaleString('en-GB') })}
            </p>
          </Card>
          <ChartAndTable
            title={filters.bucket === 'week' ? t('onTime.shareWeek') : t('onTime.shareDay')}
            caption={t('onTime.caption')}
            chart={
              <Bars
                data={r.buckets.filter((b) => b.shipped > 0)}
                x="label"
                yLabel={t('onTime.share')}
                percent
                markZero
                series={[{ key: 'share', name: t('onTime.shippedOnTime') }]}
              />
            }
            table={
              <StatTable
                label={t('onTime.table')}
                head={[t('onTime.col.from'), t('onTime.col.shipped'), t('onTime.col.onTime'), t('onTime.col.share')]}
                rows={r.buckets.map((b) => [b.label, b.shipped, b.onTime, percentText(b.share)])}
              />
            }
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
