import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { WatchSettingsDto } from '@shared/watch/watch-dto';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { WatchApi } from '../watch-api';
import { displayUnit, shown, THRESHOLD_GROUPS, THRESHOLD_TEXT, type DisplayUnit } from './threshold-views';

/**
 * A site's watch thresholds, grouped by the alert they tune, each with a plain name, what it does and its unit in
 * the organisation's system; editable at 'edit' level.
 */
@Component({
  selector: 'rm-watch-settings',
  host: { class: 'rm-page' },
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  template: `
    <header class="rm-page-header">
      <h1>Watch settings{{ siteName() ? ' · ' + siteName() : '' }}</h1>
    </header>
    <p class="intro">
      The numbers the nightly watch decides with for this site, grouped by the alert they tune. Leave a value at its
      default unless the site really differs; every change is recorded.
    </p>
    @if (settings.isLoading() && !current()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading settings" />
    }
    @if (loadError(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    }
    @if (current(); as s) {
      <section class="group" aria-labelledby="window-title">
        <h2 id="window-title">Watering window</h2>
        <p class="group-intro">The hours, on the site's clock, when the controller normally waters.</p>
        <div class="window">
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
        </div>
      </section>
      @for (g of groups; track g.title; let gi = $index) {
        <section class="group" [attr.aria-labelledby]="'group-' + gi">
          <h2 [id]="'group-' + gi">{{ g.title }}</h2>
          <p class="group-intro">{{ g.intro }}</p>
          @for (name of g.names; track name) {
            @if (byName().get(name); as t) {
              @let u = unit(t.unit);
              <div class="setting" [class.overridden]="t.overridden">
                <label class="what" [for]="'th-' + name">
                  <span class="label">{{ text[name].label }}</span>
                  @if (text[name].help) {
                    <span class="help">{{ text[name].help }}</span>
                  }
                </label>
                <span class="value">
                  <input
                    [id]="'th-' + name"
                    type="number"
                    min="0"
                    step="any"
                    [value]="show(t.value, u.factor)"
                    [disabled]="!s.canEdit"
                    (change)="setValue(name, $event, u.factor)"
                  />
                  <span class="unit">{{ u.unit }}</span>
                  @if (t.overridden) {
                    <small>default {{ show(t.defaultValue, u.factor) }}</small>
                  }
                </span>
              </div>
            }
          }
        </section>
      }
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
    :host {
      overflow-wrap: anywhere;
    }
    .intro,
    .group-intro {
      max-width: 70ch;
    }
    .group-intro {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    .group {
      margin: 20px 0;
    }
    .group h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 4px;
    }
    .setting {
      display: grid;
      grid-template-columns: minmax(0, 1fr) 300px;
      gap: 4px 16px;
      align-items: center;
      padding: 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .what {
      display: flex;
      flex-direction: column;
    }
    .help {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .value {
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 6px;
    }
    .value input {
      width: 80px;
    }
    .unit {
      font: var(--mat-sys-body-small);
    }
    .overridden {
      background: var(--mat-sys-surface-container-low);
    }
    .window {
      display: flex;
      gap: 12px;
      flex-wrap: wrap;
    }
    .error {
      color: var(--mat-sys-error);
    }
    @media (max-width: 600px) {
      .setting {
        grid-template-columns: minmax(0, 1fr);
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchSettings {
  private readonly api = inject(WatchApi);
  private readonly sites = inject(SitesApi);
  private readonly units = inject(UnitSystemStore);
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
  protected readonly groups = THRESHOLD_GROUPS;
  protected readonly text = THRESHOLD_TEXT;
  protected readonly byName = computed(() => new Map((this.current()?.thresholds ?? []).map((t) => [t.name, t])));
  private readonly site = rxResource({
    params: () => Number(this.siteId()),
    stream: ({ params }) => this.sites.get(params),
  });
  protected readonly siteName = computed(() => (this.site.hasValue() ? this.site.value().name : ''));
  protected readonly saving = signal(false);
  protected readonly saved = signal(false);
  protected readonly saveError = signal<string | null>(null);

  protected setValue(name: string, event: Event, factor: number): void {
    const entered = Number((event.target as HTMLInputElement).value);
    const t = this.current()?.thresholds.find((x) => x.name === name);
    // A value typed back to the shown default is the default itself, not a rounded override.
    const value = t && entered === shown(t.defaultValue, factor) ? t.defaultValue : entered / factor;
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

  protected unit(raw: string): DisplayUnit {
    return displayUnit(raw, this.units.metric());
  }

  protected show(value: number, factor: number): number {
    return shown(value, factor);
  }

  constructor() {
    void this.units.ensureLoaded();
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
