import { useTranslation } from 'react-i18next';
import {
  Area,
  AreaChart,
  Bar,
  BarChart,
  CartesianGrid,
  ComposedChart,
  LabelList,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';

// The house palette for series; series also differ by dash and order so the legend and the table
// beside each chart carry the meaning, not the colour alone.
export const SERIES = ['#1f5a63', '#e2b650', '#7a5a12', '#8a4b00', '#14323a', '#6b9ea5'];
const axis = { fontSize: 13, fill: '#14323a' };

export function Histogram({ data, p50, p85, unit }: { data: { bin: string; n: number }[]; p50: number | null; p85: number | null; unit: string }) {
  const { t } = useTranslation('reports');
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart data={data} margin={{ top: 20, right: 16, bottom: 24, left: 0 }}>
        <CartesianGrid strokeDasharray="3 3" />
        <XAxis dataKey="bin" tick={axis} label={{ value: unit, position: 'insideBottom', offset: -12 }} />
        <YAxis allowDecimals={false} tick={axis} label={{ value: t('chart.orders'), angle: -90, position: 'insideLeft' }} />
        <Tooltip />
        <Bar dataKey="n" name={t('chart.ordersSeries')} fill={SERIES[0]} isAnimationActive={false} />
        {p50 != null && <ReferenceLine x={binOf(data, p50)} stroke={SERIES[2]} strokeDasharray="4 2" label={{ value: 'p50', position: 'top' }} />}
        {p85 != null && <ReferenceLine x={binOf(data, p85)} stroke={SERIES[3]} strokeDasharray="8 3" label={{ value: 'p85', position: 'top' }} />}
      </BarChart>
    </ResponsiveContainer>
  );
}

function binOf(data: { bin: string; lo?: number; hi?: number }[], v: number): string | undefined {
  return (data as { bin: string; lo: number; hi: number }[]).find((d) => v >= d.lo && v < d.hi)?.bin ?? data.at(-1)?.bin;
}

/** Equal-width bins for a histogram. */
export function bins(values: number[], count = 12): { bin: string; lo: number; hi: number; n: number }[] {
  if (values.length === 0) return [];
  const max = Math.max(...values);
  const width = Math.max(1, Math.ceil(max / count));
  const out = Array.from({ length: Math.ceil((max + 1e-9) / width) || 1 }, (_, i) => ({
    bin: `${i * width}–${(i + 1) * width}`,
    lo: i * width,
    hi: (i + 1) * width,
    n: 0,
  }));
  for (const v of values) out[Math.min(out.length - 1, Math.floor(v / width))].n += 1;
  return out;
}

export function Lines({
  data,
  x,
  series,
  yLabel,
  percent = false,
}: {
  data: object[];
  x: string;
  series: { key: string; name: string }[];
  yLabel: string;
  percent?: boolean;
}) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={data} margin={{ top: 12, right: 16, bottom: 8, left: 0 }}>
        <CartesianGrid strokeDasharray="3 3" />
        <XAxis dataKey={x} tick={axis} />
        <YAxis
          tick={axis}
          domain={percent ? [0, 1] : ['auto', 'auto']}
          tickFormatter={percent ? (v: number) => `${Math.round(v * 100)}%` : undefined}
          label={{ value: yLabel, angle: -90, position: 'insideLeft' }}
        />
        <Tooltip />
        <Legend />
        {series.map((s, i) => (
          <Line
            key={s.key}
            type="monotone"
            dataKey={s.key}
            name={s.name}
            stroke={SERIES[i % SERIES.length]}
            strokeWidth={3}
            strokeDasharray={i === 0 ? undefined : `${4 + 4 * i} 4`}
            dot={false}
            isAnimationActive={false}
            connectNulls
          />
        ))}
      </LineChart>
    </ResponsiveContainer>
  );
}

export function Bars({
  data,
  x,
  series,
  yLabel,
  percent = false,
  layout = 'horizontal',
  domain,
  markZero = false,
}: {
  data: object[];
  x: string;
  series: { key: string; name: string }[];
  yLabel: string;
  percent?: boolean;
  layout?: 'horizontal' | 'vertical';
  /** the value axis (shares: see percentAxis); default 0–100 % for shares */
  domain?: [number, number];
  /** a value of 0 gets a sliver of a bar and a "0 %" label, so it differs from "no data" (no bar) */
  markZero?: boolean;
}) {
  const fmt = percent ? (v: number) => `${Math.round(v * 1000) / 10}%` : undefined;
  const valueDomain = domain ?? (percent ? ([0, 1] as [number, number]) : undefined);
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart data={data} layout={layout} margin={{ top: 12, right: 16, bottom: layout === 'vertical' ? 24 : 8, left: layout === 'vertical' ? 40 : 0 }}>
        <CartesianGrid strokeDasharray="3 3" />
        {layout === 'vertical' ? (
          <>
            <XAxis
              type="number"
              tick={axis}
              tickFormatter={fmt}
              domain={valueDomain}
              allowDataOverflow={!!domain}
              label={{ value: yLabel, position: 'insideBottom', offset: -4 }}
            />
            <YAxis type="category" dataKey={x} tick={{ ...axis, fontSize: 12 }} width={110} interval={0} />
          </>
        ) : (
          <>
            <XAxis dataKey={x} tick={axis} />
            <YAxis
              tick={axis}
              tickFormatter={fmt}
              domain={valueDomain}
              allowDataOverflow={!!domain}
              label={{ value: yLabel, angle: -90, position: 'insideLeft' }}
            />
          </>
        )}
        <Tooltip formatter={fmt ? (v) => fmt(Number(v)) : undefined} />
        <Legend />
        {series.map((s, i) => (
          <Bar key={s.key} dataKey={s.key} name={s.name} fill={SERIES[i % SERIES.length]} isAnimationActive={false} minPointSize={markZero ? 3 : 0}>
            {markZero && (
              <LabelList
                dataKey={s.key}
                position={layout === 'vertical' ? 'right' : 'top'}
                fill="#8a1c1c"
                fontWeight={700}
                formatter={(v: unknown) => (Number(v) === 0 ? (percent ? '0 %' : '0') : '')}
              />
            )}
          </Bar>
        ))}
      </BarChart>
    </ResponsiveContainer>
  );
}

/** Cumulative flow: one line per stage (not stacked); the gap between two lines is the WIP between them. */
export function CumulativeFlow({ data, stages }: { data: object[]; stages: { key: string; name: string }[] }) {
  const { t } = useTranslation('reports');
  return (
    <ResponsiveContainer width="100%" height="100%">
      <AreaChart data={data} margin={{ top: 12, right: 16, bottom: 8, left: 0 }}>
        <CartesianGrid strokeDasharray="3 3" />
        <XAxis dataKey="label" tick={axis} />
        <YAxis tick={axis} allowDecimals={false} label={{ value: t('chart.trays'), angle: -90, position: 'insideLeft' }} />
        <Tooltip />
        <Legend />
        {stages.map((s, i) => (
          <Area
            key={s.key}
            type="stepAfter"
            dataKey={s.key}
            name={s.name}
            stroke={SERIES[i % SERIES.length]}
            fill={SERIES[i % SERIES.length]}
            fillOpacity={0.35}
            strokeWidth={2}
            isAnimationActive={false}
          />
        ))}
      </AreaChart>
    </ResponsiveContainer>
  );
}

/** Pareto: bars largest first, and the running share as a line on its own axis. */
export function Pareto({ data }: { data: { name: string; qty: number; cumulativeShare: number }[] }) {
  const { t } = useTranslation('reports');
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart data={data} margin={{ top: 12, right: 16, bottom: 40, left: 0 }}>
        <CartesianGrid strokeDasharray="3 3" />
        <XAxis dataKey="name" tick={{ ...axis, fontSize: 11 }} interval={0} angle={-20} textAnchor="end" />
        <YAxis yAxisId="qty" tick={axis} label={{ value: t('chart.pieces'), angle: -90, position: 'insideLeft' }} />
        <YAxis yAxisId="share" orientation="right" domain={[0, 1]} tick={axis} tickFormatter={(v: number) => `${Math.round(v * 100)}%`} />
        <Tooltip />
        <Legend verticalAlign="top" />
        <Bar yAxisId="qty" dataKey="qty" name={t('chart.scrapped')} fill={SERIES[0]} isAnimationActive={false} />
        <Line
          yAxisId="share"
          dataKey="cumulativeShare"
          name={t('chart.runningShare')}
          stroke={SERIES[3]}
          strokeWidth={3}
          strokeDasharray="6 3"
          isAnimationActive={false}
        />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
