import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/** A tiny inline SVG trend line (no chart library, so the portfolio stays in the light bundle). */
@Component({
  selector: 'rm-sparkline',
  template: `
    <svg
      [attr.viewBox]="'0 0 ' + width + ' ' + height"
      [attr.width]="width"
      [attr.height]="height"
      role="img"
      [attr.aria-label]="label()"
    >
      <polyline
        [attr.points]="points()"
        fill="none"
        stroke="var(--rm-rill, #2f7d8c)"
        stroke-width="1.5"
        stroke-linejoin="round"
      />
      @if (last(); as p) {
        <circle [attr.cx]="p[0]" [attr.cy]="p[1]" r="2.2" fill="var(--rm-deep, #0f3c48)" />
      }
    </svg>
  `,
  styles: `
    :host {
      display: inline-block;
      line-height: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Sparkline {
  readonly values = input.required<number[]>();
  readonly label = input('Trend');
  protected readonly width = 88;
  protected readonly height = 24;

  private readonly coords = computed(() => {
    const v = this.values();
    const max = Math.max(...v, 0) || 1;
    const dx = v.length > 1 ? (this.width - 4) / (v.length - 1) : 0;
    return v.map((y, i) => [2 + i * dx, this.height - 2 - (y / max) * (this.height - 4)] as const);
  });
  protected readonly points = computed(() =>
    this.coords()
      .map(([x, y]) => `${x.toFixed(1)},${y.toFixed(1)}`)
      .join(' '),
  );
  protected readonly last = computed(() => this.coords().at(-1));
}
