import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMoney } from '~/lib/estimate';
import type { FinishValue } from '~/lib/shared/report-figures';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS } from './chart-style';

/** Value going ahead per finish, one horizontal bar each, biggest first. */
export default function FinishValueChart({ finishes, currency, locale }: { finishes: FinishValue[]; currency: string; locale: string }) {
  const money = (value: unknown) => (typeof value === 'number' ? formatMoney(Math.round(value), currency, locale, { wholeUnits: true }) : '');
  return (
    <ResponsiveContainer width="100%" height={Math.max(CHART_HEIGHT / 2, 48 * finishes.length + 40)}>
      <BarChart data={finishes} layout="vertical" margin={{ top: 8, right: 16, bottom: 0, left: 0 }}>
        <CartesianGrid stroke="#E9D8B4" horizontal={false} />
        <XAxis type="number" dataKey="valueCents" tickFormatter={money} tick={AXIS_TICK} />
        <YAxis type="category" dataKey="finish" tick={AXIS_TICK} width={150} />
        <Tooltip formatter={money} />
        <Bar dataKey="valueCents" name="Value going ahead" fill={SERIES_COLOURS[0]} isAnimationActive={false} />
      </BarChart>
    </ResponsiveContainer>
  );
}
