/**
 * Each report as a CSV file: RFC 4180 (CRLF line ends, fields quoted when they hold a comma, a
 * quote or a line break; csv-stringify does the quoting), one heading row, numbers written plainly
 * (weeks as their Monday, money in whole currency units with cents, waits in working hours), and
 * every cell guarded against being read as a formula (`leads/csv-guard.ts`).
 */
import { stringify } from 'csv-stringify/sync';
import { FUNNEL_COLUMNS, REPORT_SOURCES, percentOf } from '~/lib/shared/report-figures';
import { sourceLabel } from '~/lib/shared/labels';
import type { ReportName } from '~/lib/shared/report-range';
import { guardCell } from '../leads/csv-guard';
import type { ReportFigures } from './reports';

const percent = (part: number, whole: number) => {
  const value = percentOf(part, whole);
  return value === null ? '' : value.toFixed(1);
};
const hours = (minutes: number | null) => (minutes === null ? '' : (minutes / 60).toFixed(2));
const money = (cents: number) => (cents / 100).toFixed(2);

type Sheet = (string | number)[][];

const SHEETS: { [N in ReportName]: (figures: ReportFigures[N], currency: string) => Sheet } = {
  funnel: ({ weeks, total }) => {
    const conversions = FUNNEL_COLUMNS.slice(1).map((step, i) => `${step.label} of ${FUNNEL_COLUMNS[i]!.label.toLowerCase()} (%)`);
    const row = (label: string, figures: (typeof weeks)[number] | typeof total) => [
      label,
      ...FUNNEL_COLUMNS.map(({ key }) => figures[key]),
      ...FUNNEL_COLUMNS.slice(1).map(({ key }, i) => percent(figures[key], figures[FUNNEL_COLUMNS[i]!.key])),
    ];
    return [['Week from', ...FUNNEL_COLUMNS.map((c) => c.label), ...conversions], ...weeks.map((w) => row(w.week, w)), row('Total', total)];
  },
  'response-times': ({ weeks, total }) => {
    const row = (label: string, f: typeof total) => [
      label,
      f.received,
      f.answered,
      hours(f.medianMinutes),
      hours(f.p90Minutes),
      f.withinTarget,
      f.decided,
      percent(f.withinTarget, f.decided),
    ];
    return [
      [
        'Week from',
        'Inquiries',
        'Answered',
        'Median wait (working hours)',
        '90th percentile wait (working hours)',
        'Answered within target',
        'Answered or past due',
        'Within target (%)',
      ],
      ...weeks.map((w) => row(w.week, w)),
      row('Total', total),
    ];
  },
  'value-by-finish': ({ finishes, jobs, valueCents }, currency) => [
    ['Finish', 'Jobs going ahead', `Value (${currency})`],
    ...finishes.map((f) => [f.finish, f.jobs, money(f.valueCents)]),
    ['Total', jobs, money(valueCents)],
  ],
  sources: ({ weeks, total }) => [
    ['Week from', ...REPORT_SOURCES.map(sourceLabel), 'All'],
    ...weeks.map((w) => [w.week, ...REPORT_SOURCES.map((s) => w.counts[s]), w.total]),
    ['Total', ...REPORT_SOURCES.map((s) => total[s]), total.all],
  ],
};

export function reportCsv<N extends ReportName>(name: N, figures: ReportFigures[N], currency: string): string {
  const sheet = SHEETS[name](figures, currency).map((row) => row.map((cell) => guardCell(String(cell))));
  return stringify(sheet, { record_delimiter: 'windows' });
}
