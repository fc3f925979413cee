/*
 * A small line chart drawn as inline SVG text, for printable pages that must not load anything: axes with
 * rounded tick values, one polyline per series, a legend. No scripts, no external fonts.
 */

export interface ChartSeries {
  name: string;
  x: readonly number[];
  y: readonly number[];
  /** CSS colour; a palette colour when absent. */
  color?: string;
  dashed?: boolean;
}

export interface LineChart {
  title: string;
  xLabel: string;
  yLabel: string;
  series: readonly ChartSeries[];
  width?: number;
  height?: number;
}

const palette = ['#1f5fa8', '#b4572e', '#2e8b57', '#8a3ffc', '#6b6b6b', '#c0392b'];
const margin = { left: 64, right: 16, top: 40, bottom: 44 };

/** Escapes text for XML and HTML content and attributes. */
export function escapeMarkup(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * Tick values covering [low, high] at a step of 1, 2 or 5 times a power of ten, about `count` of them (the
 * usual "nice numbers" choice; common practice, no source).
 */
export function niceTicks(low: number, high: number, count = 5): number[] {
  if (!(high > low)) return [low];
  const rough = (high - low) / Math.max(1, count);
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((f) => f * power).find((s) => s >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(low / step) * step; v <= high + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

function extent(values: number[]): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, 1];
  let low = Math.min(...finite);
  let high = Math.max(...finite);
  if (low === high) {
    const pad = low === 0 ? 1 : Math.abs(low) * 0.1;
    low -= pad;
    high += pad;
  }
  return [low, high];
}

function tickLabel(value: number): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  return magnitude >= 1e4 || magnitude < 1e-3 ? value.toExponential(1) : String(Number(value.toPrecision(6)));
}

/** The chart as an `<svg>` element (text). */
export function lineChartSvg(chart: LineChart): string {
  const width = chart.width ?? 640;
  const height = chart.height ?? 260;
  const plotWidth = width - margin.left - margin.right;
  const plotHeight = height - margin.top - margin.bottom;
  const [xLow, xHigh] = extent(chart.series.flatMap((s) => [...s.x]));
  const [yLow, yHigh] = extent(chart.series.flatMap((s) => [...s.y]));
  const px = (x: number) => margin.left + ((x - xLow) / (xHigh - xLow)) * plotWidth;
  const py = (y: number) => margin.top + (1 - (y - yLow) / (yHigh - yLow)) * plotHeight;
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-label="${escapeMarkup(chart.title)}" font-family="sans-serif" font-size="11">`,
    `<text x="${margin.left}" y="16" font-size="13" font-weight="bold">${escapeMarkup(chart.title)}</text>`,
    `<rect x="${margin.left}" y="${margin.top}" width="${plotWidth}" height="${plotHeight}" fill="none" stroke="#999"/>`,
  );
  for (const x of niceTicks(xLow, xHigh, 8)) {
    const at = px(x).toFixed(1);
    parts.push(
      `<line x1="${at}" y1="${margin.top}" x2="${at}" y2="${margin.top + plotHeight}" stroke="#e4e4e4"/>`,
      `<text x="${at}" y="${margin.top + plotHeight + 14}" text-anchor="middle">${tickLabel(x)}</text>`,
    );
  }
  for (const y of niceTicks(yLow, yHigh, 5)) {
    const at = py(y).toFixed(1);
    parts.push(
      `<line x1="${margin.left}" y1="${at}" x2="${margin.left + plotWidth}" y2="${at}" stroke="#e4e4e4"/>`,
      `<text x="${margin.left - 6}" y="${at}" text-anchor="end" dominant-baseline="middle">${tickLabel(y)}</text>`,
    );
  }
  parts.push(
    `<text x="${margin.left + plotWidth / 2}" y="${height - 8}" text-anchor="middle">${escapeMarkup(chart.xLabel)}</text>`,
    `<text transform="translate(14 ${margin.top + plotHeight / 2}) rotate(-90)" text-anchor="middle">${escapeMarkup(chart.yLabel)}</text>`,
  );
  chart.series.forEach((series, k) => {
    const color = series.color ?? palette[k % palette.length]!;
    const points = series.x
      .map((x, i) => [x, series.y[i]!] as const)
      .filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y))
      .map(([x, y]) => `${px(x).toFixed(1)},${py(y).toFixed(1)}`)
      .join(' ');
    parts.push(
      `<polyline points="${points}" fill="none" stroke="${color}" stroke-width="1.5"${series.dashed ? ' stroke-dasharray="5 3"' : ''}/>`,
      `<line x1="${margin.left + 8 + k * 150}" y1="${margin.top - 10}" x2="${margin.left + 28 + k * 150}" y2="${margin.top - 10}" stroke="${color}" stroke-width="2"${series.dashed ? ' stroke-dasharray="5 3"' : ''}/>`,
      `<text x="${margin.left + 32 + k * 150}" y="${margin.top - 6}">${escapeMarkup(series.name)}</text>`,
    );
  });
  parts.push('</svg>');
  return parts.join('\n');
}
