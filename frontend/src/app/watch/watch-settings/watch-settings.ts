import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { WatchSettingsDto } from '@shared/watch/watch-dto';
import { describeApiError } from '../../core/http/api-error';
import { WatchApi } from '../watch-api';

/** A site's watch thresholds, each with what it does in plain words; editable at 'edit' level. */
@Component({
  selector: 'rm-watch-settings',
  host: { class: 'rm-page' },
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  template: `
    <h1>Watch settings</h1>
    <p class="intro">
      The numbers the nightly watch decides with for this site. Leave a value at its default unless the site really
      differs; every change is recorded.
    </p>
    @if (settings.isLoading() && !current()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading settings" />
    }
    @if (loadError(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    }
    @if (current(); as s) {
      <section class="window" aria-label="Irrigation window">
        <h2>Watering window (site's local hours)</h2>
        <mat-form-field
          ><mat-label>Starts at hour (0–23)</mat-label>
          <input
            matInput
            type="number"
            min="0"
            max="23"
            [value]="s.irrigationWindow.startHour"
            [disabled]="!s.canEdit"
            (change)="setWindow('startHour', $event)"
        /></mat-form-field>
        <mat-form-field
          ><mat-label>Ends before hour (0–23)</mat-label>
          <input
            matInput
            type="number"
            min="0"
            max="23"
            [value]="s.irrigationWindow.endHour"
            [disabled]="!s.canEdit"
            (change)="setWindow('endHour', $event)"
        /></mat-form-field>
      </section>
      <table class="thresholds" aria-label="Thresholds">
        <thead>
          <tr>
            <th>Setting</th>
            <th>Value</th>
            <th>What it does</th>
          </tr>
        </thead>
        <tbody>
          @for (t of s.thresholds; track t.name) {
            <tr [class.overridden]="t.overridden">
              <td>{{ t.name }}</td>
              <td class="value">
                <input
                  type="number"
                  min="0"
                  step="any"
                  [value]="t.value"
                  [disabled]="!s.canEdit"
                  [attr.aria-label]="t.name + ' in ' + t.unit"
                  (change)="setValue(t.name, $event)"
                />
                {{ t.unit }}
                @if (t.overridden) {
                  <small>(default {{ t.defaultValue }})</small>
                }
              </td>
              <td>{{ t.explanation }}</td>
            </tr>
          }
        </tbody>
      </table>
      @if (s.canEdit) {
        <button mat-flat-button type="button" [disabled]="saving()" (click)="save()">Save settings</button>
      } @else {
        <p>You can read these settings; changing them needs edit access to the site.</p>
      }
      @if (saveError(); as message) {
        <p class="error" role="alert">{{ message }}</p>
      }
      @if (saved()) {
        <p role="status">Saved. The next night's run uses these values.</p>
      }
    }
  `,
  styles: `
    .intro {
      max-width: 70ch;
    }
    .thresholds {
      border-collapse: collapse;
      width: 100%;
      margin: 16px 0;
    }
    .thresholds th,
    .thresholds td {
      text-align: left;
      padding: 6px 8px;
      border-bottom: 1px solid #dde3df;
      vertical-align: top;
    }
    .value {
      white-space: nowrap;
    }
    .value input {
      width: 80px;
    }
    .overridden {
      background: #f4f8f6;
    }
    .window {
      display: flex;
      gap: 12px;
      align-items: baseline;
      flex-wrap: wrap;
    }
    .window h2 {
      width: 100%;
    }
    .error {
      color: #a3261b;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchSettings {
  private readonly api = inject(WatchApi);
  /** Route parameter. */
  readonly siteId = input.required<string>();

  protected readonly settings = rxResource({
    params: () => Number(this.siteId()),
    stream: ({ params }) => this.api.settings(params),
  });
  protected readonly current = linkedSignal<WatchSettingsDto | null>(() =>
    this.settings.hasValue() ? this.settings.value() : null,
  );
  protected readonly loadError = computed(() =>
    this.settings.error() ? describeApiError(this.settings.error(), 'The settings could not be loaded.').message : null,
  );
  protected readonly saving = signal(false);
  protected readonly saved = signal(false);
  protected readonly saveError = signal<string | null>(null);

  protected setValue(name: string, event: Event): void {
    const value = Number((event.target as HTMLInputElement).value);
    this.current.update(
      (s) =>
        s && {
          ...s,
          thresholds: s.thresholds.map((t) =>
            t.name === name ? { ...t, value, overridden: value !== t.defaultValue } : t,
          ),
        },
    );
  }

  protected setWindow(which: 'startHour' | 'endHour', event: Event): void {
    const value = Number((event.target as HTMLInputElement).value);
    this.current.update((s) => s && { ...s, irrigationWindow: { ...s.irrigationWindow, [which]: value } });
  }

  protected save(): void {
    const s = this.current();
    if (!s) return;
    this.saving.set(true);
    this.saved.set(false);
    this.saveError.set(null);
    const thresholds = Object.fromEntries(
      s.thresholds.filter((t) => t.value !== t.defaultValue).map((t) => [t.name, t.value]),
    );
    this.api.saveSettings(s.siteId, { thresholds, irrigationWindow: s.irrigationWindow }).subscribe({
      next: (fresh) => (this.current.set(fresh), this.saving.set(false), this.saved.set(true)),
      error: (err: unknown) => (
        this.saveError.set(describeApiError(err, 'The settings could not be saved.').message),
        this.saving.set(false)
      ),
    });
  }
}
