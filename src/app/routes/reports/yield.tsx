import { createColumnHelper } from '@tanstack/react-table';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { REPORT_READERS } from '@shared/domain/access';
import type { YieldOrder } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars, Pareto } from '@/features/reports/components/charts';
import { useStations } from '@/features/stations/api/get-stations';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { percentText } from '@/lib/duration';
import { percentAxis } from '@/features/reports/lib/percent-axis';

export const handle = { roles: REPORT_READERS };

const col = createColumnHelper<YieldOrder>();
const columnsFor = (t: TFunction<'reports'>) => [
  col.accessor('number', { header: t('yield.orderCol.order') }),
  col.accessor('customer', { header: t('yield.orderCol.customer') }),
  col.accessor('inQty', { header: t('yield.orderCol.piecesIn') }),
  col.accessor('goodQty', { header: t('yield.orderCol.goodOut') }),
  col.accessor('reworkQty', { header: t('yield.orderCol.reworked') }),
  col.accessor('rolledThroughputYield', { header: t('yield.orderCol.rty'), cell: (c) => percentText(c.getValue(), 2) }),
  col.accessor('finalYield', { header: t('yield.orderCol.finalYield'), cell: (c) => percentText(c.getValue(), 2) }),
];

export function Component() {
  const { t } = useTranslation(['reports', 'common']);
  const { report, frame } = useReportPage('yield', { station: true });
  const stations = useStations();
  const r = report.data;
  // yields sit near 100 %: the axis starts just below the lowest bar
  const axis = r ? percentAxis(r.steps.flatMap((s) => [s.firstPassYield, s.finalYield])) : null;
  return (
    <ReportFrame {...frame} stations={stations.data ?? []} note={t('yield.note')}>
      {report.isPending ? (
        <Loading label={t('yield.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <ChartAndTable
            title={t('yield.perStep')}
            caption={axis?.zoomed ? t('yield.zoomed', { start: percentText(axis.domain[0], 1) }) : undefined}
            chart={
              <Bars
                layout="vertical"
                percent
                domain={axis?.domain}
                data={r.steps.map((s) => ({
                  kind: t(`common:kind.${s.stationKind}` as 'common:kind.fill', { defaultValue: s.stationKind }),
                  fpy: s.firstPassYield,
                  fy: s.finalYield,
                }))}
                x="kind"
                yLabel={t('yield.axis')}
                series={[
                  { key: 'fpy', name: t('yield.fpy') },
                  { key: 'fy', name: t('yield.finalYield') },
                ]}
              />
            }
            table={
              <StatTable
                label={t('yield.stepTable')}
                head={[
                  t('yield.col.kind'),
                  t('yield.col.in'),
                  t('yield.col.passedFirst'),
                  t('yield.col.good'),
                  t('yield.col.scrap'),
                  t('yield.col.reworked'),
                  t('yield.col.firstPass'),
                  t('yield.col.final'),
                ]}
                rows={r.steps.map((s) => [
                  t(`common:kind.${s.stationKind}` as 'common:kind.fill', { defaultValue: s.stationKind }),
                  s.inQty,
                  s.firstPassQty,
                  s.goodQty,
                  s.scrapQty,
                  s.reworkQty,
                  percentText(s.firstPassYield, 2),
                  percentText(s.finalYield, 2),
                ])}
              />
            }
          />
          <ChartAndTable
            title={t('yield.scrapTitle')}
            caption={t('yield.scrapCaption', { qty: r.rework.qty.toLocaleString('en-GB') })}
            chart={<Pareto data={r.scrap} />}
            table={
              <StatTable
                label={t('yield.scrapTable')}
                head={[t('yield.scrapCol.reason'), t('yield.scrapCol.pieces'), t('yield.scrapCol.share'), t('yield.scrapCol.running')]}
                rows={r.scrap.map((s) => [s.name, s.qty, percentText(s.share), percentText(s.cumulativeShare)])}
              />
            }
          />
          <Card>
            <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('yield.rtyTitle')}</h2>
            <DataTable data={r.orders} columns={columnsFor(t)} filterLabel={t('yield.find')} caption={t('yield.ordersCaption')} />
          </Card>
        </>
      ) : null}
    </ReportFrame>
  );
}
