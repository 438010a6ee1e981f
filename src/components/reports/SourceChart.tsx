import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { sourceLabel } from '~/lib/shared/labels';
import { REPORT_SOURCES, type SourceWeek } from '~/lib/shared/report-figures';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS, weekName } from './chart-style';

/** Inquiries per week, stacked by where they came from. */
export default function SourceChart({ weeks }: { weeks: SourceWeek[] }) {
  const data = weeks.map((w) => ({ week: w.week, ...w.counts }));
  return (
    <ResponsiveContainer width="100%" height={CHART_HEIGHT}>
      <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: 0 }}>
        <CartesianGrid stroke="#E9D8B4" vertical={false} />
        <XAxis dataKey="week" tickFormatter={weekName} tick={AXIS_TICK} />
        <YAxis allowDecimals={false} tick={AXIS_TICK} width={40} />
        <Tooltip labelFormatter={(week) => `Week of ${weekName(String(week))}`} />
        <Legend />
        {REPORT_SOURCES.map((source, i) => (
          <Bar key={source} dataKey={source} name={sourceLabel(source)} stackId="sources" fill={SERIES_COLOURS[i]} isAnimationActive={false} />
        ))}
      </BarChart>
    </ResponsiveContainer>
  );
}
