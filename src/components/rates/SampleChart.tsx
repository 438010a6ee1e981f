import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMoney } from '~/lib/estimate';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS } from '~/components/reports/chart-style';

export type SampleBar = { finish: string; published: number | null; draft: number | null };

/** The middle of each sample room's range, published beside draft, in whole currency units. The table beside it has the same figures. */
export default function SampleChart({ bars, currency, locale }: { bars: SampleBar[]; currency: string; locale: string }) {
  const money = (value: unknown) => (typeof value === 'number' ? formatMoney(Math.round(value) * 100, currency, locale, { wholeUnits: true }) : '—');
  return (
    <ResponsiveContainer width="100%" height={CHART_HEIGHT}>
      <BarChart data={bars} margin={{ top: 8, right: 8, bottom: 0, left: 8 }}>
        <CartesianGrid stroke="#E9D8B4" vertical={false} />
        <XAxis dataKey="finish" tick={AXIS_TICK} interval={0} />
        <YAxis tick={AXIS_TICK} width={64} tickFormatter={money} />
        <Tooltip formatter={money} />
        <Legend />
        <Bar dataKey="published" name="Published" fill={SERIES_COLOURS[2]} isAnimationActive={false} />
        <Bar dataKey="draft" name="Draft" fill={SERIES_COLOURS[0]} isAnimationActive={false} />
      </BarChart>
    </ResponsiveContainer>
  );
}
