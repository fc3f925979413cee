import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import { formatFigure } from '../format/figure-pipe';
import { chartInk, chartPalette } from './chart-palette';

/** One line of a plot: x and y of equal length. */
export interface ChartSeries {
  name: string;
  x: readonly number[];
  y: readonly (number | null)[];
  /** Drawn dashed (a reference, such as a recording under a simulation). */
  dashed?: boolean;
  /** Markers at every point (short series such as error against size). */
  points?: boolean;
  color?: string;
}

/** A horizontal reference line across the plot (a threshold, a noise floor). */
export interface ChartMark {
  label: string;
  y: number;
}

/**
 * A line plot on ECharts (lazy chunk): value axes, a tooltip on the nearest x, zoom by wheel or pinch on long
 * series, no animation, and LTTB thinning so long recordings draw quickly.
 */
@Component({
  selector: 'app-line-chart',
  imports: [NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('./echarts-setup').then((m) => m.echarts) })],
  template: `<div echarts class="chart" [style.height.px]="height()" [options]="options()" role="img" [attr.aria-label]="ariaLabel()"></div>`,
  styles: `
    :host { display: block; min-width: 0; }
    .chart { width: 100%; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineChart {
  readonly series = input.required<readonly ChartSeries[]>();
  readonly xLabel = input('');
  readonly yLabel = input('');
  readonly height = input(240);
  readonly logY = input(false);
  readonly marks = input<readonly ChartMark[]>([]);
  /** Whole numbers on the x axis (sizes). */
  readonly integerX = input(false);
  readonly ariaLabel = input.required<string>();

  protected readonly options = computed((): EChartsCoreOption => {
    const series = this.series();
    const long = series.some((s) => s.x.length > 400);
    const legend = series.length > 1;
    return {
      animation: false,
      color: chartPalette,
      textStyle: { fontFamily: 'Roboto, sans-serif', color: chartInk.text },
      grid: { left: 16, right: 24, top: (legend ? 30 : 10) + (this.yLabel() ? 18 : 0), bottom: long ? 44 : 30, containLabel: true },
      legend: legend ? { top: 0, left: 0, icon: 'roundRect', itemWidth: 14, itemHeight: 4, textStyle: { color: chartInk.text } } : undefined,
      tooltip: {
        trigger: 'axis',
        valueFormatter: (value: unknown) => (typeof value === 'number' ? formatFigure(value, 4) : String(value ?? '–')),
      },
      xAxis: {
        type: 'value',
        name: this.xLabel(),
        nameLocation: 'middle',
        nameGap: 26,
        scale: !this.integerX(),
        min: 'dataMin',
        max: 'dataMax',
        minInterval: this.integerX() ? 1 : undefined,
        axisLine: { lineStyle: { color: chartInk.axis } },
        splitLine: { show: false },
        axisLabel: { formatter: (value: number) => formatFigure(value, 3), hideOverlap: true },
      },
      yAxis: {
        type: this.logY() ? 'log' : 'value',
        name: this.yLabel(),
        nameTextStyle: { align: 'left' },
        scale: true,
        axisLine: { show: false },
        splitLine: { lineStyle: { color: chartInk.grid } },
        axisLabel: { formatter: (value: number) => formatFigure(value, 2) },
      },
      dataZoom: long ? [{ type: 'inside', xAxisIndex: 0, filterMode: 'none' }, { type: 'slider', height: 16, bottom: 4, showDetail: false }] : [],
      series: series.map((s, i) => ({
        type: 'line',
        name: s.name,
        data: s.x.map((x, k) => [x, s.y[k] ?? null]),
        showSymbol: !!s.points,
        symbolSize: 7,
        sampling: 'lttb',
        connectNulls: false,
        lineStyle: { width: s.dashed ? 1.5 : 1.8, type: s.dashed ? 'dashed' : 'solid' },
        color: s.color,
        emphasis: { disabled: true },
        markLine:
          i === 0 && this.marks().length
            ? {
                silent: true,
                symbol: 'none',
                lineStyle: { color: chartInk.axis, type: 'dotted' },
                label: { formatter: '{b}', position: 'insideEndTop', color: chartInk.text },
                data: this.marks().map((m) => ({ name: m.label, yAxis: m.y })),
              }
            : undefined,
      })),
    };
  });
}
