import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { SiteOverviewDto } from '@shared/readings/readings-dto';

const fmt = (n: number | null | undefined, digits = 0) =>
  n === null || n === undefined ? '—' : n.toLocaleString('en-US', { maximumFractionDigits: digits });

/** Daily use (bars) against the daily budget (line), with ETo and rain on a second axis and upload/alert markers. */
@Component({
  selector: 'rm-daily-chart',
  imports: [NgxEchartsDirective],
  template: `<div echarts class="chart" [options]="options()" role="img" [attr.aria-label]="summary()"></div>`,
  styles: `
    .chart {
      height: 340px;
      width: 100%;
    }
    @media (max-width: 600px) {
      .chart {
        height: 280px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DailyChart {
  readonly data = input.required<SiteOverviewDto>();

  protected readonly summary = computed(() => {
    const d = this.data();
    return (
      `Daily use against budget from ${d.from} to ${d.to}: ${fmt(d.figures.useGallons)} ` +
      `gal used, budget ${fmt(d.figures.budgetGallons)} gal`
    );
  });

  protected readonly options = computed<EChartsCoreOption>(() => {
    const d = this.data();
    const days = d.days;
    const markers = [
      ...d.uploads.map((u) => ({
        xAxis: u.date,
        name: `Upload: ${u.fileName}`,
        lineStyle: { color: '#7a8b99', type: 'dotted' as const },
      })),
      ...d.alerts.map((a) => ({
        xAxis: a.date,
        name: `Alert: ${a.title}`,
        lineStyle: { color: '#b3261e', type: 'solid' as const },
      })),
    ];
    return {
      animation: false,
      textStyle: { fontFamily: 'Open Sans, sans-serif' },
      legend: { top: 0, type: 'scroll' },
      tooltip: {
        trigger: 'axis',
        formatter: (items: { dataIndex: number }[]) => {
          const day = days[items[0]?.dataIndex ?? 0];
          if (!day) return '';
          const marks = markers
            .filter((m) => m.xAxis === day.date)
            .map((m) => `<br/>${m.name}`)
            .join('');
          return (
            `<b>${day.date}</b><br/>Use ${fmt(day.useGallons)} gal · budget ` +
            `${fmt(day.budgetGallons)} gal<br/>ETo ${fmt(day.etoMm, 1)} mm ` +
            `· rain ${fmt(day.rainMm, 1)} mm${marks}`
          );
        },
      },
      grid: { left: 64, right: 56, top: 40, bottom: 64 },
      dataZoom: [{ type: 'inside' }, { type: 'slider', height: 18, bottom: 8 }],
      xAxis: { type: 'category', data: days.map((x) => x.date) },
      yAxis: [
        { type: 'value', name: 'Water (gal/day)', nameLocation: 'middle', nameGap: 48 },
        { type: 'value', name: 'ETo, rain (mm/day)', nameLocation: 'middle', nameGap: 36, splitLine: { show: false } },
      ],
      series: [
        {
          name: 'Use (gal)',
          type: 'bar',
          data: days.map((x) => x.useGallons),
          barMaxWidth: 14,
          color: '#2f7d8c',
          itemStyle: {
            color: (p: { dataIndex: number }) =>
              (days[p.dataIndex]?.useGallons ?? 0) > (days[p.dataIndex]?.budgetGallons ?? Infinity)
                ? '#a4562a'
                : '#2f7d8c',
          },
          markLine: markers.length
            ? { symbol: 'none', silent: false, label: { show: false }, data: markers }
            : undefined,
        },
        {
          name: 'Budget (gal)',
          type: 'line',
          step: 'middle',
          data: days.map((x) => x.budgetGallons),
          symbol: 'none',
          lineStyle: { color: '#0f3c48', width: 2 },
          itemStyle: { color: '#0f3c48' },
        },
        {
          name: 'ETo (mm)',
          type: 'line',
          yAxisIndex: 1,
          data: days.map((x) => x.etoMm),
          symbol: 'none',
          lineStyle: { color: '#c49a2c', width: 1, type: 'dashed' },
          itemStyle: { color: '#c49a2c' },
        },
        {
          name: 'Rain (mm)',
          type: 'bar',
          yAxisIndex: 1,
          data: days.map((x) => x.rainMm),
          barMaxWidth: 6,
          itemStyle: { color: '#5b7fb8' },
        },
      ],
    };
  });
}
