import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import type { UnitSystem } from '@shared/budgets/budget-dto';
import { convertArea, mmToInches } from '@shared/units/area-depth-units';
import { formatArea, formatDepth, formatVolume } from '@shared/units/format-quantity';
import { fromGallons } from '@shared/units/volume-units';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { LoadError } from '../../shared/load-error/load-error';
import { OrganisationApi } from '../../shared/unit-system/organisation-api';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';

interface SystemOption {
  value: UnitSystem;
  label: string;
  units: string;
  example: string;
}

// One invented month at one site, shown in each system so the choice is concrete.
const EXAMPLE = { gallons: 12_500, depthMm: 38, areaFt2: 8_000 };

const OPTIONS: SystemOption[] = [
  {
    value: 'us',
    label: 'US customary',
    units: 'gallons (gal), inches (in), square feet (ft²)',
    example:
      `${formatVolume(EXAMPLE.gallons, 'gal')} · ${formatDepth(mmToInches(EXAMPLE.depthMm), 'in')} ` +
      `· ${formatArea(EXAMPLE.areaFt2, 'ft2')}`,
  },
  {
    value: 'metric',
    label: 'Metric',
    units: 'cubic metres (m³), millimetres (mm), square metres (m²)',
    example:
      `${formatVolume(fromGallons(EXAMPLE.gallons, 'm3'), 'm3')} · ` +
      `${formatDepth(EXAMPLE.depthMm, 'mm')} · ${formatArea(convertArea(EXAMPLE.areaFt2, 'ft2', 'm2'), 'm2')}`,
  },
];

/** The organisation's unit system: administrators choose it, everyone else sees which one is in force. */
@Component({
  selector: 'rm-unit-settings',
  imports: [MatRadioModule, MatButtonModule, MatIconModule, MatProgressBarModule, LoadError],
  templateUrl: './unit-settings.html',
  styleUrl: './unit-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitSettings {
  private readonly api = inject(OrganisationApi);
  private readonly units = inject(UnitSystemStore);
  private readonly auth = inject(AuthStore);

  protected readonly options = OPTIONS;
  protected readonly canChange = computed(() => this.auth.capabilities().manageSettings);
  protected readonly settings = rxResource({ stream: () => this.api.settings() });
  protected readonly loadError = computed(() =>
    this.settings.error()
      ? describeApiError(this.settings.error(), 'The organisation settings could not be loaded.').message
      : null,
  );
  /** What is saved on the server; the choice below starts from it and is reset whenever it changes. */
  private readonly stored = linkedSignal<UnitSystem | null>(() =>
    this.settings.hasValue() ? this.settings.value().unitSystem : null,
  );
  protected readonly choice = linkedSignal<UnitSystem | null>(() => this.stored());
  protected readonly inForce = computed(() => OPTIONS.find((o) => o.value === this.stored()) ?? null);
  protected readonly unchanged = computed(() => this.choice() === this.stored());
  protected readonly saving = signal(false);
  protected readonly message = signal<{ text: string; error: boolean } | null>(null);

  protected choose(system: UnitSystem): void {
    this.choice.set(system);
    this.message.set(null);
  }

  protected async save(): Promise<void> {
    const system = this.choice();
    if (!system || this.unchanged()) return;
    this.saving.set(true);
    this.message.set(null);
    try {
      // Through the store, so pages already open (budgets, dashboard) switch too.
      await this.units.change(system);
      this.stored.set(this.units.system());
      this.message.set({ text: `Saved. Figures are now shown in ${this.inForce()?.label} units.`, error: false });
    } catch (err) {
      this.message.set({ text: describeApiError(err, 'The unit system could not be saved.').message, error: true });
    } finally {
      this.saving.set(false);
    }
  }
}
