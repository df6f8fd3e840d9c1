import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { COSTING_READERS } from '@shared/domain/access';
import { ReportFrame } from '@/features/reports/components/report-frame';
import { filterParams } from '@/features/reports/components/report-frame';
import { useReportFilters } from '@/features/reports/components/use-report-filters';
import { useReportFilterOptions } from '@/features/reports/api/get-filters';
import { costingCsvUrl, useCostingReport } from '@/features/costing/api/get-costing';
import { useCostFormats } from '@/features/costing/components/money';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';

export const handle = { roles: COSTING_READERS };

const num = 'px-2 py-1.5 text-right tabular-nums';

export function Component() {
  const { t } = useTranslation('costing');
  const f = useCostFormats();
  const [filters, setFilters] = useReportFilters();
  const params = filterParams(filters);
  const report = useCostingReport(params);
  const options = useReportFilterOptions();
  const r = report.data;
  const m = (x: number) => (r ? f.money(x, r.currency) : '');
  const total = r
    ? r.rows.reduce((s, g) => ({ quoted: s.quoted + g.quoted, actual: s.actual + g.actual, orders: s.orders + g.orders }), { quoted: 0, actual: 0, orders: 0 })
    : null;
  return (
    <ReportFrame filters={filters} onChange={setFilters} customers={options.data?.customers ?? []} csvUrl={costingCsvUrl(params)} note={t('report.note')}>
      {report.isPending ? (
        <Loading label={t('report.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r && total ? (
        <>
          <Card>
            <p className="text-lg" data-testid="costing-summary">
              {t('report.summary', {
                count: total.orders,
                quoted: m(total.quoted),
                actual: m(total.actual),
                variance: f.signed(total.actual - total.quoted, r.currency),
              })}
            </p>
            {r.otherCurrency > 0 && <p className="text-sm text-harbour-700">{t('report.otherCurrency', { count: r.otherCurrency })}</p>}
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('report.byGroup')}</h2>
            <div className="overflow-x-auto" tabIndex={0} aria-label={t('report.byGroup')}>
              <table className="w-full text-left text-sm">
                <thead>
                  <tr className="border-b-2 border-harbour-100">
                    <th scope="col" className="px-2 py-2">
                      {t('report.col.process')}
                    </th>
                    {(['colours', 'orders', 'quoted', 'actual', 'variance', 'variancePct'] as const).map((k) => (
                      <th key={k} scope="col" className="px-2 py-2 text-right">
                        {t(`report.col.${k}`)}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {r.rows.map((g) => (
                    <tr key={`${g.process}-${g.colours}`} className="border-b border-harbour-50">
                      <th scope="row" className="px-2 py-1.5 font-normal">
                        {t(`common:process.${g.process}`, { defaultValue: g.process })}
                      </th>
                      <td className={num}>{g.colours}</td>
                      <td className={num}>{g.orders}</td>
                      <td className={num}>{m(g.quoted)}</td>
                      <td className={num}>{m(g.actual)}</td>
                      <td className={`${num} font-bold ${g.variance > 0 ? 'text-stop-700' : ''}`}>{f.signed(g.variance, r.currency)}</td>
                      <td className={num}>{f.pct(g.variancePct)}</td>
                    </tr>
                  ))}
                  {r.rows.length === 0 && (
                    <tr>
                      <td colSpan={7} className="px-2 py-4 text-center text-harbour-700">
                        {t('report.none')}
                      </td>
                    </tr>
                  )}
                </tbody>
              </table>
            </div>
          </Card>
          {r.orders.length > 0 && (
            <Card>
              <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('report.orders')}</h2>
              <div className="max-h-[32rem] overflow-auto" tabIndex={0} aria-label={t('report.orders')}>
                <table className="w-full text-left text-sm">
                  <thead className="sticky top-0 bg-white">
                    <tr className="border-b-2 border-harbour-100">
                      {(['order', 'customer', 'process', 'basis', 'shipped'] as const).map((k) => (
                        <th key={k} scope="col" className="px-2 py-2">
                          {t(`report.col.${k}`)}
                        </th>
                      ))}
                      {(['colours', 'quoted', 'actual', 'variance'] as const).map((k) => (
                        <th key={k} scope="col" className="px-2 py-2 text-right">
                          {t(`report.col.${k}`)}
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {r.orders.map((o) => (
                      <tr key={o.orderId} className="border-b border-harbour-50">
                        <th scope="row" className="px-2 py-1.5">
                          <Link className="font-bold text-harbour-800 underline" to={`/orders/${o.orderId}`}>
                            {o.number}
                          </Link>
                        </th>
                        <td className="px-2 py-1.5">{o.customer}</td>
                        <td className="px-2 py-1.5">{t(`common:process.${o.process}`, { defaultValue: o.process })}</td>
                        <td className="px-2 py-1.5">{t(`report.basis_${o.basis}`)}</td>
                        <td className="px-2 py-1.5">{f.day(o.shippedAt)}</td>
                        <td className={num}>{o.colours}</td>
                        <td className={num}>{m(o.quoted)}</td>
                        <td className={num}>{m(o.actual)}</td>
                        <td className={`${num} font-bold ${o.variance > 0 ? 'text-stop-700' : ''}`}>{f.signed(o.variance, r.currency)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </Card>
          )}
        </>
      ) : null}
    </ReportFrame>
  );
}
