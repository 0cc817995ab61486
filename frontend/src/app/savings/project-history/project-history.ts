import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { SavingsApi } from '../savings-api';

/** A savings project's audit trail: who changed what and why, newest first. */
@Component({
  selector: 'rm-project-history',
  template: `
    @if (history.hasValue()) {
      <ol class="trail" aria-label="Project history">
        @for (h of history.value().items; track $index) {
          <li>
            <div>
              <strong>{{ h.action }}</strong> · {{ h.userName }} · <time [attr.datetime]="h.at">{{ when(h.at) }}</time>
            </div>
            @for (line of h.lines; track $index) {
              <div class="line">{{ line }}</div>
            }
            @if (h.reason) {
              <div class="line">Reason: {{ h.reason }}</div>
            }
          </li>
        }
      </ol>
    } @else if (history.error()) {
      <p class="sub">The history could not be loaded.</p>
    }
  `,
  styles: `
    .trail {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .line,
    .sub {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectHistory {
  private readonly api = inject(SavingsApi);
  readonly projectId = input.required<number>();

  protected readonly history = rxResource({
    params: () => this.projectId(),
    stream: ({ params }) => this.api.history(params),
  });

  protected when(iso: string): string {
    return new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));
  }
}
