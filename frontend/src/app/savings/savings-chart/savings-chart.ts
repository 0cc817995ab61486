import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { SavingsReportDto } from '@shared/savings/savings-project-dto';

/**
 * Per month: metered use as bars, the model as a line (fitted over the baseline, predicted over the reporting
 * period), so the gap after the change is the savings. Display only.
 */
@Component({
  selector: 'rm-savings-chart',
  imports: [NgxEchartsDirective],
  template: `<div echarts class="chart" [options]="options()" role="img" [attr.aria-label]="summary()"></div>`,
  styles: `
    .chart {
      height: 340px;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavingsChart {
  readonly report = input.required<SavingsReportDto>();

  protected readonly summary = computed(() => {
    const r = this.report();
    return (
      `Monthly metered use against the weather-adjusted baseline: ${r.baselineMonths.length} ` +
      `baseline months, ${r.reportingMonths.length} reporting months`
    );
  });

  protected readonly options = computed<EChartsCoreOption>(() => {
    const r = this.report();
    const predicted = new Map(r.savings.periods.map((p) => [p.label, p.predictedGal]));
    const months = [
      ...r.baselineMonths.map((m) => ({ ...m, model: m.fittedGal, period: 'baseline' })),
      ...r.reportingMonths.map((m) => ({ ...m, model: predicted.get(m.month) ?? null, period: 'reporting' })),
    ];
    const round = (v: number | null) => (v === null ? null : Math.round(v));
    return {
      animation: false,
      legend: { top: 0 },
      tooltip: {
        trigger: 'axis',
        valueFormatter: (v: number | null) => (v === null ? '—' : `${Math.round(v).toLocaleString('en-US')} gal`),
      },
      grid: { left: 72, right: 24, top: 40, bottom: 40 },
      xAxis: { type: 'category', data: months.map((m) => m.month) },
      yAxis: { type: 'value', name: 'Use (gal/month)', nameLocation: 'middle', nameGap: 56 },
      series: [
        {
          name: 'Metered, baseline',
          type: 'bar',
          stack: 'use',
          data: months.map((m) => (m.period === 'baseline' ? round(m.useGal) : null)),
          itemStyle: { color: '#9aa9b3' },
        },
        {
          name: 'Metered, after the change',
          type: 'bar',
          stack: 'use',
          data: months.map((m) => (m.period === 'reporting' ? round(m.useGal) : null)),
          itemStyle: { color: '#2f7d6d' },
        },
        {
          name: 'Baseline model (fitted, then predicted)',
          type: 'line',
          data: months.map((m) => round(m.model)),
          itemStyle: { color: '#b5573c' },
          lineStyle: { width: 2 },
          connectNulls: false,
        },
      ],
    };
  });
}
