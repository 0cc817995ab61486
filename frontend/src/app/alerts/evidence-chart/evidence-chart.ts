import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { ChartSeries } from '@shared/watch/finding';
import { siteTime } from '../site-time';

/** The series behind an alert, with the alert's period shaded; times on the axis in the site's zone. Display only. */
@Component({
  selector: 'rm-evidence-chart',
  imports: [NgxEchartsDirective],
  template: `<div echarts class="chart" [options]="options()" role="img" [attr.aria-label]="summary()"></div>`,
  styles: `
    .chart {
      height: 320px;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EvidenceChart {
  readonly series = input.required<ChartSeries[]>();
  readonly timeZone = input.required<string>();
  readonly periodStartUtc = input.required<string>();
  readonly periodEndUtc = input.required<string>();
  /** What the shaded period is: the alert's, or the nights after a repair. */
  readonly periodLabel = input('Alert period');

  protected readonly summary = computed(() =>
    this.series()
      .map((s) => `${s.label} (${s.unit}), ${s.points.length} points`)
      .join('; '),
  );

  protected readonly options = computed<EChartsCoreOption>(() => {
    const zone = this.timeZone();
    const units = [...new Set(this.series().map((s) => s.unit))];
    return {
      animation: false,
      legend: { top: 0 },
      tooltip: {
        trigger: 'axis',
        valueFormatter: (v: number) =>
          typeof v === 'number' ? v.toLocaleString('en-US', { maximumFractionDigits: 1 }) : String(v),
      },
      grid: { left: 64, right: units.length > 1 ? 64 : 24, top: 40, bottom: 64 },
      dataZoom: [{ type: 'inside' }, { type: 'slider', height: 18, bottom: 8 }],
      xAxis: {
        type: 'time',
        axisLabel: {
          formatter: (ms: number) => siteTime(new Date(ms).toISOString(), zone, false).replace(/, \d{4},/, ','),
        },
      },
      yAxis: units.map((unit, i) => ({ type: 'value', name: unit, position: i === 0 ? 'left' : 'right' })),
      series: this.series().map((s, i) => ({
        name: `${s.label} (${s.unit})`,
        type: s.unit === 'min' ? 'bar' : 'line',
        step: s.unit === 'min' ? undefined : 'end',
        showSymbol: false,
        yAxisIndex: units.indexOf(s.unit),
        data: s.points.map((p) => [p.atUtc, p.value]),
        ...(i === 0
          ? {
              markArea: {
                itemStyle: { color: 'rgba(196, 84, 44, 0.12)' },
                data: [
                  [
                    { xAxis: Date.parse(this.periodStartUtc()), name: this.periodLabel() },
                    { xAxis: Date.parse(this.periodEndUtc()) },
                  ],
                ],
              },
            }
          : {}),
      })),
    };
  });
}
