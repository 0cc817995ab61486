import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { HourlyGridDto } from '@shared/readings/readings-dto';

const HOURS = Array.from({ length: 24 }, (_, h) => `${String(h).padStart(2, '0')}:00`);

/**
 * Gallons per hour of each day in the site's local time. Irrigation runs show as short bright bands;
 * flow through every night hour (a leak, a stuck valve) shows as a lit column block where the night should be dark.
 */
@Component({
  selector: 'rm-flow-grid',
  imports: [NgxEchartsDirective],
  template: `<div echarts class="chart" [options]="options()" role="img" [attr.aria-label]="summary()"></div>`,
  styles: `
    .chart {
      height: 420px;
      width: 100%;
    }
    @media (max-width: 600px) {
      .chart {
        height: 520px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlowGrid {
  readonly grid = input.required<HourlyGridDto>();

  protected readonly summary = computed(() => {
    const g = this.grid();
    const night = g.days.reduce((s, d) => s + d.hours.slice(0, 5).reduce<number>((a, h) => a + (h ?? 0), 0), 0);
    return (
      `Hour-by-day flow for ${g.month} in ${g.timeZone}; ${Math.round(night).toLocaleString('en-US')} ` +
      'gal between midnight and 05:00 over the month'
    );
  });

  protected readonly options = computed<EChartsCoreOption>(() => {
    const g = this.grid();
    const cells: [number, number, number | null][] = [];
    g.days.forEach((d, day) =>
      d.hours.forEach((v, hour) => cells.push([hour, day, v === null ? null : Math.round(v * 10) / 10])),
    );
    return {
      animation: false,
      textStyle: { fontFamily: 'Open Sans, sans-serif' },
      tooltip: {
        formatter: (p: { data: [number, number, number | null] }) => {
          const [hour, day, v] = p.data;
          return (
            `${g.days[day]?.date} ${HOURS[hour]}–${HOURS[(hour + 1) % 24]} ` +
            `(${g.timeZone})<br/>${v === null ? 'no reading' : `${v.toLocaleString('en-US')} gal`}`
          );
        },
      },
      grid: { left: 56, right: 16, top: 8, bottom: 96 },
      xAxis: {
        type: 'category',
        data: HOURS,
        name: `Local hour (${g.timeZone})`,
        nameLocation: 'middle',
        nameGap: 28,
        splitArea: { show: true },
      },
      yAxis: { type: 'category', data: g.days.map((d) => d.date.slice(5)), inverse: true, axisLabel: { interval: 1 } },
      visualMap: {
        min: 0,
        max: Math.max(1, g.maxGallons),
        calculable: false,
        orient: 'horizontal',
        left: 'center',
        bottom: 0,
        itemHeight: 120,
        text: [`${Math.round(g.maxGallons).toLocaleString('en-US')} gal/h`, '0 gal/h'],
        inRange: { color: ['#eef5f3', '#8cc4c0', '#2f7d8c', '#0f3c48'] },
      },
      series: [{ type: 'heatmap', data: cells, emphasis: { itemStyle: { borderColor: '#0f3c48', borderWidth: 1 } } }],
    };
  });
}
