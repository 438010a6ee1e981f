import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { FUNNEL_COLUMNS, type FunnelWeek } from '~/lib/shared/report-figures';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS, weekName } from './chart-style';

/** The widget funnel: a group of bars per week, one bar per step. The table below has the same figures. */
export default function FunnelChart({ weeks }: { weeks: FunnelWeek[] }) {
  return (
    <ResponsiveContainer width="100%" height={CHART_HEIGHT}>
      <BarChart data={weeks} margin={{ top: 8, right: 8, bottom: 0, left: 0 }}>
        <CartesianGrid stroke="#E9D8B4" vertical={false} />
        <XAxis dataKey="week" tickFormatter={weekName} tick={AXIS_TICK} />
        <YAxis allowDecimals={false} tick={AXIS_TICK} width={40} />
        <Tooltip labelFormatter={(week) => `Week of ${weekName(String(week))}`} />
        <Legend />
        {FUNNEL_COLUMNS.map((column, i) => (
          <Bar key={column.key} dataKey={column.key} name={column.label} fill={SERIES_COLOURS[i]} isAnimationActive={false} />
        ))}
      </BarChart>
    </ResponsiveContainer>
  );
}
