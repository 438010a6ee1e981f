import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS } from '~/components/reports/chart-style';

/** How many recent inquiries would move by how much: one bar per band of change. The table beside it has the same figures. */
export default function ReplayChart({ bands }: { bands: { label: string; count: number }[] }) {
  return (
    <ResponsiveContainer width="100%" height={CHART_HEIGHT}>
      <BarChart data={bands} margin={{ top: 8, right: 8, bottom: 0, left: 0 }}>
        <CartesianGrid stroke="#E9D8B4" vertical={false} />
        <XAxis dataKey="label" tick={AXIS_TICK} interval={0} />
        <YAxis allowDecimals={false} tick={AXIS_TICK} width={40} />
        <Tooltip />
        <Bar dataKey="count" name="Inquiries" fill={SERIES_COLOURS[0]} isAnimationActive={false} />
      </BarChart>
    </ResponsiveContainer>
  );
}
