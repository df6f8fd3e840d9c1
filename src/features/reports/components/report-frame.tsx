import type { ReactNode } from 'react';
import { Download, Info } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { PROCESSES } from '@shared/domain/vocabulary';
import { factoryTodayDate } from '@/lib/datetime';
import { defaultWindow } from '../lib/summary';
import { SelectField, TextField } from '@/components/ui/field';
import { Card } from '@/components/ui/panels';

export interface ReportFilterValues {
  from: string;
  to: string;
  process: string;
  customerId: string;
  stationId: string;
  bucket: string;
}

export function defaultFilters(lastDataDay?: string | null): ReportFilterValues {
  // the last four weeks with data (factory days, as the server reads "from" and "to")
  const { from, to } = defaultWindow(lastDataDay, factoryTodayDate());
  return { from, to, process: '', customerId: '', stationId: '', bucket: 'day' };
}

/** Only the filters a report uses, without the empty ones: the API query and the CSV link. */
export function filterParams(f: ReportFilterValues, use: { station?: boolean; bucket?: boolean } = {}): Record<string, string> {
  const p: Record<string, string> = { from: f.from, to: f.to };
  if (f.process) p.process = f.process;
  if (f.customerId) p.customerId = f.customerId;
  if (use.station && f.stationId) p.stationId = f.stationId;
  if (use.bucket) p.bucket = f.bucket || 'day';
  return p;
}

export function ReportFrame({
  filters,
  onChange,
  customers,
  stations,
  bucket,
  csvUrl,
  children,
  note,
  percentiles = false,
}: {
  filters: ReportFilterValues;
  onChange: (patch: Partial<ReportFilterValues>) => void;
  customers: { id: string; name: string }[];
  /** given when the report can be narrowed to one station */
  stations?: { id: string; code: string; name: string }[];
  bucket?: boolean;
  csvUrl: string;
  children: ReactNode;
  note?: ReactNode;
  /** the report shows percentiles: say how they are computed (only there) */
  percentiles?: boolean;
}) {
  const { t } = useTranslation(['reports', 'common']);
  return (
    <div className="flex flex-col gap-4">
      <Card>
        <form className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-7" onSubmit={(e) => e.preventDefault()} aria-label={t('frame.filters')}>
          <TextField label={t('frame.from')} type="date" value={filters.from} max={filters.to} onChange={(e) => onChange({ from: e.target.value })} />
          <TextField label={t('frame.to')} type="date" value={filters.to} min={filters.from} onChange={(e) => onChange({ to: e.target.value })} />
          <SelectField label={t('frame.process')} value={filters.process} onChange={(e) => onChange({ process: e.target.value })}>
            <option value="">{t('frame.allProcesses')}</option>
            {PROCESSES.map((p) => (
              <option key={p} value={p}>
                {t(`common:process.${p}`)}
              </option>
            ))}
          </SelectField>
          <SelectField label={t('frame.customer')} value={filters.customerId} onChange={(e) => onChange({ customerId: e.target.value })}>
            <option value="">{t('frame.allCustomers')}</option>
            {customers.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </SelectField>
          {stations && (
            <SelectField label={t('frame.station')} value={filters.stationId} onChange={(e) => onChange({ stationId: e.target.value })}>
              <option value="">{t('frame.allStations')}</option>
              {stations.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.code} · {s.name}
                </option>
              ))}
            </SelectField>
          )}
          {bucket && (
            <SelectField label={t('frame.per')} value={filters.bucket} onChange={(e) => onChange({ bucket: e.target.value })}>
              <option value="day">{t('frame.day')}</option>
              <option value="week">{t('frame.week')}</option>
            </SelectField>
          )}
          <div className="flex items-end">
            <a
              href={csvUrl}
              // the server names the file after the report and its period
              download
              className="flex min-h-11 w-full items-center justify-center gap-2 rounded-lg border-2 border-harbour-800 px-4 font-bold text-harbour-800 hover:bg-harbour-50"
            >
              <Download className="h-5 w-5" aria-hidden /> {t('frame.csv')}
            </a>
          </div>
        </form>
      </Card>
      <p className="flex items-start gap-2 text-sm text-harbour-700">
        <Info className="mt-0.5 h-4 w-4 shrink-0" aria-hidden />
        <span>
          {percentiles && t('frame.percentiles', { authors: 'Hyndman & Fan', numpy: 'NumPy' })}
          {t('frame.localDays')} {note}
        </span>
      </p>
      {children}
    </div>
  );
}

/** A chart and the table of the same figures, side by side on a wide screen. */
/**
 * A chart with its table. `bars` (a bar per row, drawn across) gives the chart the height its bars
 * need; from a dozen rows on, the chart and the table stand one above the other at full width.
 */
export function ChartAndTable({
  title,
  chart,
  table,
  caption,
  bars,
}: {
  title: string;
  chart: ReactNode;
  table: ReactNode;
  caption?: ReactNode;
  bars?: number;
}) {
  const { t } = useTranslation('reports');
  const tall = bars != null && bars > 12;
  return (
    <Card>
      <h2 className="mb-1 text-xl font-bold text-harbour-900">{title}</h2>
      {caption && <p className="mb-3 text-sm text-harbour-700">{caption}</p>}
      <div className={`grid gap-6 ${tall ? '' : 'xl:grid-cols-[3fr_2fr]'}`}>
        <div className={tall ? 'min-w-0' : 'h-96 min-w-0'} style={tall ? { height: bars * 32 + 90 } : undefined}>
          {chart}
        </div>
        {/* the table keeps the chart's height and scrolls; its header stays in view */}
        <div
          className={`${tall ? '' : 'max-h-96'} min-w-0 overflow-auto rounded-lg border border-harbour-50`}
          tabIndex={0}
          aria-label={t('frame.tableOf', { title })}
        >
          {table}
        </div>
      </div>
    </Card>
  );
}

export function StatTable({ head, rows, label }: { head: string[]; rows: (string | number)[][]; label: string }) {
  const { t } = useTranslation('reports');
  return (
    <table className="w-full text-left text-sm" aria-label={label}>
      <thead className="sticky top-0 bg-white">
        <tr className="border-b-2 border-harbour-100">
          {head.map((h, j) => (
            // a column of numbers has its header over the numbers, on the right
            <th key={h} scope="col" className={`px-2 py-2 font-bold ${rows.length > 0 && rows.every((r) => typeof r[j] === 'number') ? 'text-right' : ''}`}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-harbour-50">
            {r.map((c, j) => (
              <td key={j} className={`px-2 py-1.5 ${typeof c === 'number' ? 'text-right tabular-nums' : ''}`}>
                {typeof c === 'number' ? c.toLocaleString('en-GB') : c}
              </td>
            ))}
          </tr>
        ))}
        {rows.length === 0 && (
          <tr>
            <td colSpan={head.length} className="px-2 py-4 text-center text-harbour-700">
              {t('frame.empty')}
            </td>
          </tr>
        )}
      </tbody>
    </table>
  );
}
