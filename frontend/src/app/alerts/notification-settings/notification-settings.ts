import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import type { NotificationFrequency, NotificationPreferenceDto } from '@shared/alerts/alert-dto';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { AlertsApi } from '../alerts-api';

/** The signed-in user's alert e-mail: how often, and for which sites. */
@Component({
  selector: 'rm-notification-settings',
  host: { class: 'rm-page' },
  imports: [MatRadioModule, MatCheckboxModule, MatButtonModule, MatProgressBarModule],
  template: `
    <h1>Alert e-mail</h1>
    @if (pref.isLoading() && !current()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading" />
    }
    @if (error(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    }
    @if (current(); as p) {
      <mat-radio-group aria-label="How often" [value]="p.frequency" (change)="setFrequency($event.value)">
        <mat-radio-button value="daily">One digest each morning with the night's new alerts</mat-radio-button>
        <mat-radio-button value="each">One e-mail per new alert</mat-radio-button>
        <mat-radio-button value="none">No e-mail (check the inbox yourself)</mat-radio-button>
      </mat-radio-group>
      <h2>Sites</h2>
      <mat-checkbox [checked]="p.siteIds === null" (change)="followAll($event.checked)"
        >Every site I can see, including ones added later</mat-checkbox
      >
      @if (p.siteIds !== null) {
        <ul class="sites">
          @for (s of sites(); track s.id) {
            <li>
              <mat-checkbox [checked]="p.siteIds.includes(s.id)" (change)="follow(s.id, $event.checked)">{{
                s.name
              }}</mat-checkbox>
            </li>
          } @empty {
            <li>No sites to choose from.</li>
          }
        </ul>
      }
      <button mat-flat-button type="button" [disabled]="saving()" (click)="save()">Save</button>
      @if (saved()) {
        <p role="status">Saved.</p>
      }
    }
  `,
  styles: `
    h1 {
      font: var(--mat-sys-headline-small);
      margin: 0 0 12px;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 16px 0 4px;
    }
    mat-radio-group {
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    mat-checkbox {
      display: block;
      margin-bottom: 12px;
    }
    .sites {
      list-style: none;
      padding: 0;
    }
    .error {
      color: #a3261b;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationSettings {
  private readonly api = inject(AlertsApi);
  private readonly sitesApi = inject(SitesApi);
  protected readonly pref = rxResource({ stream: () => this.api.notifications() });
  protected readonly current = linkedSignal<NotificationPreferenceDto | null>(() =>
    this.pref.hasValue() ? this.pref.value() : null,
  );
  private readonly siteList = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });
  protected readonly sites = computed(() => (this.siteList.hasValue() ? this.siteList.value().items : []));
  protected readonly saving = signal(false);
  protected readonly saved = signal(false);
  private readonly saveError = signal<string | null>(null);
  protected readonly error = computed(
    () =>
      this.saveError() ??
      (this.pref.error() ? describeApiError(this.pref.error(), 'Your preference could not be loaded.').message : null),
  );

  protected setFrequency(frequency: NotificationFrequency): void {
    this.current.update((p) => p && { ...p, frequency });
  }

  protected followAll(all: boolean): void {
    this.current.update((p) => p && { ...p, siteIds: all ? null : this.sites().map((s) => s.id) });
  }

  protected follow(siteId: number, on: boolean): void {
    this.current.update(
      (p) =>
        p && { ...p, siteIds: on ? [...(p.siteIds ?? []), siteId] : (p.siteIds ?? []).filter((id) => id !== siteId) },
    );
  }

  protected save(): void {
    const p = this.current();
    if (!p) return;
    this.saving.set(true);
    this.saved.set(false);
    this.saveError.set(null);
    this.api.saveNotifications(p).subscribe({
      next: (fresh) => (this.current.set(fresh), this.saving.set(false), this.saved.set(true)),
      error: (err: unknown) => (
        this.saveError.set(describeApiError(err, 'Your preference could not be saved.').message),
        this.saving.set(false)
      ),
    });
  }
}
