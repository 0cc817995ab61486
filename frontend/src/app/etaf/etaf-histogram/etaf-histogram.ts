import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { EtafBin } from '@shared/etaf/etaf-dto';

/** Sites per 0.1 of achieved ETAF; the bin holding `mark` (one site) is drawn in the accent colour. */
@Component({
  selector: 'rm-etaf-histogram',
  template: `
    <figure class="histogram">
      <div class="bars" aria-hidden="true">
        @for (b of bins(); track b.from) {
          <div class="bar" [class.mark]="isMarked(b)" [class.over]="b.from >= (limit() ?? 99)">
            <span class="count">{{ b.count || '' }}</span>
            <span class="fill" [style.height.%]="(100 * b.count) / max()"></span>
            <span class="label">{{ b.to === null ? b.from + '+' : b.from.toFixed(1) }}</span>
          </div>
        }
      </div>
      <figcaption>{{ caption() }}</figcaption>
      <div class="rm-visually-hidden">
        <table>
          <caption>
            {{
              caption()
            }}
          </caption>
          <tr>
            <th scope="col">Achieved ETAF</th>
            <th scope="col">Sites</th>
          </tr>
          @for (b of bins(); track b.from) {
            <tr>
              <td>{{ b.to === null ? b.from + ' and over' : b.from.toFixed(1) + '–' + b.to.toFixed(1) }}</td>
              <td>{{ b.count }}</td>
            </tr>
          }
        </table>
      </div>
    </figure>
  `,
  styles: `
    .histogram {
      margin: 0;
    }
    .bars {
      display: grid;
      grid-template-columns: repeat(16, minmax(0, 1fr));
      align-items: end;
      gap: 2px;
      height: 140px;
    }
    .bar {
      display: flex;
      flex-direction: column;
      justify-content: flex-end;
      align-items: stretch;
      height: 100%;
      min-width: 0;
    }
    .fill {
      display: block;
      background: var(--mat-sys-primary);
      opacity: 0.55;
      border-radius: 3px 3px 0 0;
      min-height: 1px;
    }
    .over .fill {
      background: var(--mat-sys-error);
    }
    .mark .fill {
      opacity: 1;
      outline: 2px solid var(--mat-sys-on-surface);
    }
    .count,
    .label {
      font-size: 0.65rem;
      text-align: center;
      color: var(--mat-sys-on-surface-variant);
      overflow: hidden;
    }
    figcaption {
      color: var(--mat-sys-on-surface-variant);
      margin-top: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EtafHistogram {
  readonly bins = input.required<EtafBin[]>();
  readonly caption = input.required<string>();
  readonly mark = input<number | null>(null);
  /** Bins from this ETAF up are drawn as over the allowance. */
  readonly limit = input<number | null>(null);
  protected readonly max = computed(() => Math.max(1, ...this.bins().map((b) => b.count)));

  protected isMarked(b: EtafBin): boolean {
    const m = this.mark();
    return m !== null && m >= b.from && (b.to === null || m < b.to);
  }
}
