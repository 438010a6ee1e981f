import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { ResponseReport } from '~/lib/shared/report-figures';
import { AXIS_TICK, CHART_HEIGHT, SERIES_COLOURS, weekName } from './chart-style';

/** Median and 90th-percentile wait per week, in working hours; weeks with no answered inquiry leave a gap. */
export default function ResponseChart({ weeks }: { weeks: ResponseReport['weeks'] }) {
  const data = weeks.map((w) => ({
    week: w.week,
    median: w.medianMinutes === null ? null : w.medianMinutes / 60,
    p90: w.p90Minutes === null ? null : w.p90Minutes / 60,
  }));
  const hours = (value: unknown) => (typeof value === 'number' ? `${value.toFixed(1)} h` : '—');
  return (
    <ResponsiveContainer width="100%" height={CHART_HEIGHT}>
      <LineChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: 0 }}>
        <CartesianGrid stroke="#E9D8B4" vertical={false} />
        <XAxis dataKey="week" tickFormatter={weekName} tick={AXIS_TICK} />
        <YAxis tick={AXIS_TICK} width={40} unit=" h" />
        <Tooltip labelFormatter={(week) => `Week of ${weekName(String(week))}`} formatter={hours} />
        <Legend />
        <Line dataKey="median" name="Median" stroke={SERIES_COLOURS[0]} strokeWidth={2} isAnimationActive={false} />
        <Line dataKey="p90" name="90th percentile" stroke={SERIES_COLOURS[3]} strokeWidth={2} strokeDasharray="5 3" isAnimationActive={false} />
      </LineChart>
    </ResponsiveContainer>
  );
}
