import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import {
  ALERT_RESOLUTIONS,
  KIND_LABELS,
  RESOLUTION_LABELS,
  SEVERITY_LABELS,
  SUB_KIND_LABELS,
  VERIFICATION_LABELS,
  type AlertDetailDto,
  type AlertResolution,
} from '@shared/alerts/alert-dto';
import { describeApiError } from '../../core/http/api-error';
import { AlertsApi } from '../alerts-api';
import { EvidenceChart } from '../evidence-chart/evidence-chart';
import { evidenceRows } from './evidence-rows';
import { gallons, money, siteTime } from '../site-time';

/** One alert: what the watch saw (chart and numbers), in plain words, what it cost, and who did what about it. */
@Component({
  selector: 'rm-alert-detail',
  host: { class: 'rm-page' },
  imports: [
    RouterLink,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    EvidenceChart,
  ],
  templateUrl: './alert-detail.html',
  styleUrl: './alert-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AlertDetail {
  private readonly api = inject(AlertsApi);
  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly loaded = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.get(params),
  });
  /** The latest copy: an action's response replaces the loaded one. */
  private readonly updated = signal<AlertDetailDto | null>(null);
  protected readonly alert = computed(() => {
    const fresh = this.updated();
    const base = this.loaded.hasValue() ? this.loaded.value() : null;
    return fresh && fresh.id === base?.id ? fresh : base;
  });
  protected readonly loadError = computed(() => {
    const error = this.loaded.error();
    return error ? describeApiError(error, 'The alert could not be loaded.').message : null;
  });
  protected readonly title = computed(() => {
    const a = this.alert();
    return a ? `${KIND_LABELS[a.kind]} — ${SUB_KIND_LABELS[a.subKind] ?? a.subKind}` : 'Alert';
  });
  protected readonly numbers = computed(() => evidenceRows(this.alert()?.evidence.numbers ?? {}));
  protected readonly severityLabels: Record<string, string> = SEVERITY_LABELS;
  protected readonly siteTime = siteTime;
  protected readonly gallons = gallons;
  protected readonly money = money;

  protected readonly verificationNumbers = computed(() => evidenceRows(this.alert()?.verification?.numbers ?? {}));
  protected readonly resolutions = ALERT_RESOLUTIONS;
  protected readonly resolutionLabels = RESOLUTION_LABELS;
  protected readonly verificationLabels = VERIFICATION_LABELS;

  protected note = '';
  protected resolution: AlertResolution = 'fixed';
  /** The repair's day (YYYY-MM-DD); empty means today. */
  protected repairedOn = '';
  protected readonly busy = signal(false);
  protected readonly actionError = signal<string | null>(null);

  protected act(action: 'acknowledge' | 'resolve' | 'notes'): void {
    const a = this.alert();
    if (!a) return;
    this.busy.set(true);
    this.actionError.set(null);
    const note = this.note.trim();
    const request =
      action === 'resolve'
        ? this.api.resolve(a.id, {
            resolution: this.resolution,
            ...(note ? { note } : {}),
            ...(this.resolution === 'fixed' && this.repairedOn ? { repairedOn: this.repairedOn } : {}),
          })
        : this.api.act(a.id, action, note);
    request.subscribe({
      next: (fresh) => {
        this.updated.set(fresh);
        this.note = '';
        this.busy.set(false);
      },
      error: (err: unknown) => {
        this.actionError.set(describeApiError(err, 'That did not work; please try again.').message);
        this.busy.set(false);
      },
    });
  }
}
