import type { Chart, Series } from '../../../../shared/plots';
import { formatNumber } from '../../../../shared/engine/number-format';

export interface SummaryRow {
  where: string;
  value: string;
}
export interface SeriesSummary {
  label: string;
  rows: SummaryRow[];
}

const f = (v: number): string => formatNumber(v, 4);

function rowsOf(s: Series, xUnit: string): SummaryRow[] {
  if (s.shape === 'line') return s.points.map(([x, y]) => ({ where: `at ${f(x)} ${xUnit}`, value: f(y) }));
  const rows: SummaryRow[] = [];
  for (let i = 0; i + 1 < s.points.length; i += 2) {
    const [[x1, y], [x2]] = [s.points[i], s.points[i + 1]];
    // Neighbouring pieces with the same value read as one stretch.
    const prev = rows[rows.length - 1];
    if (prev && prev.value === f(y)) prev.where = `${prev.where.split('–')[0]}–${f(x2)} ${xUnit}`;
    else rows.push({ where: `${f(x1)}–${f(x2)} ${xUnit}`, value: f(y) });
  }
  return rows;
}

/** Every value a sighted reader takes from the chart, as rows for a visually hidden table. */
export function summariseChart(chart: Chart): SeriesSummary[] {
  return chart.series.map((s) => ({ label: `${s.label} (${chart.yUnit})`, rows: rowsOf(s, chart.xUnit) }));
}

/** One sentence for aria-label: the range of each series and each limit with its value. */
export function describeChart(chart: Chart): string {
  const parts = chart.series.map((s) => {
    const ys = s.points.map((p) => p[1]);
    return ys.length
      ? `${s.label} from ${f(Math.min(...ys))} to ${f(Math.max(...ys))} ${chart.yUnit}`
      : `${s.label}: no data`;
  });
  const limits = chart.limits.map((l) => `limit ${l.label} at ${f(l.y)} ${chart.yUnit}`);
  const span = `along ${f(chart.x.max)} ${chart.xUnit}`;
  return `${chart.title}, ${span}: ${[...parts, ...limits].join('; ')}.`;
}
