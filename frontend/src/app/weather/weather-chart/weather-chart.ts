import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import { mmToInches } from '@shared/units/area-depth-units';
import { DAILY_WEATHER_METHOD_LABELS, type DailyWeatherDto } from '@shared/weather/weather-station-dto';

function niceCeil(value: number): number {
  const step = 10 ** Math.floor(Math.log10(value));
  return Math.ceil(value / step) * step;
}

/**
 * Daily ETo as bars (days filled from normals in a separate, hatched series so they can never pass for
 * measurements) and rain hanging from the top on its own axis. Display only.
 */
@Component({
  selector: 'rm-weather-chart',
  imports: [NgxEchartsDirective],
  template: `<div echarts class="chart" [options]="options()" role="img" [attr.aria-label]="summary()"></div>`,
  styles: `
    .chart {
      height: 360px;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeatherChart {
  readonly days = input.required<DailyWeatherDto[]>();
  readonly metric = input(false);

  protected readonly summary = computed(() => {
    const d = this.days();
    const filled = d.filter((x) => x.filled).length;
    return `Daily ETo and rain, ${d.length} days${filled ? `, ${filled} filled from monthly normals` : ''}`;
  });

  protected readonly options = computed<EChartsCoreOption>(() => {
    const unit = this.metric() ? 'mm' : 'in';
    const v = (mm: number) => (this.metric() ? Math.round(mm * 10) / 10 : Math.round(mmToInches(mm) * 1000) / 1000);
    const days = this.days();
    return {
      animation: false,
      legend: { top: 0 },
      tooltip: {
        trigger: 'axis',
        formatter: (items: { dataIndex: number }[]) => {
          const d = days[items[0]?.dataIndex ?? 0];
          if (!d) return '';
          return (
            `${d.date}<br/>ETo ${v(d.etoMm)} ${unit} · rain ${v(d.rainMm)} ` +
            `${unit}<br/>${DAILY_WEATHER_METHOD_LABELS[d.method]} · source: ` +
            `${d.source}${d.filled ? `<br/><b>filled from normals (${d.filledFields.join(', ')})</b>` : ''}`
          );
        },
      },
      grid: { left: 56, right: 56, top: 40, bottom: 56 },
      dataZoom: [{ type: 'inside' }, { type: 'slider', height: 18, bottom: 8 }],
      xAxis: { type: 'category', data: days.map((d) => d.date) },
      yAxis: [
        { type: 'value', name: `ETo (${unit}/day)`, nameLocation: 'middle', nameGap: 40 },
        // Rain hangs from the top and uses the upper third, so it never hides the ETo bars.
        {
          type: 'value',
          name: `Rain (${unit})`,
          nameLocation: 'middle',
          nameGap: 40,
          inverse: true,
          axisLabel: { showMaxLabel: false },
          max: (x: { max: number }) => niceCeil(Math.max(x.max * 3, this.metric() ? 10 : 0.4)),
        },
      ],
      series: [
        {
          name: 'ETo, station',
          type: 'bar',
          stack: 'eto',
          data: days.map((d) => (d.filled ? null : v(d.etoMm))),
          itemStyle: { color: '#3b7f6a' },
        },
        {
          name: 'ETo, filled from normals',
          type: 'bar',
          stack: 'eto',
          data: days.map((d) => (d.filled ? v(d.etoMm) : null)),
          itemStyle: {
            color: '#e0a33a',
            decal: { symbol: 'rect', dashArrayX: [1, 0], dashArrayY: [2, 3], rotation: -0.8 },
          },
        },
        {
          name: 'Rain',
          type: 'bar',
          yAxisIndex: 1,
          data: days.map((d) => v(d.rainMm)),
          itemStyle: { color: '#4d79b8' },
        },
      ],
    };
  });
}
