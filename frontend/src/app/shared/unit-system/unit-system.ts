import { Injectable, computed, inject, signal } from '@angular/core';
import type { UnitSystem } from '@shared/budgets/budget-dto';
import { convertArea, mmToInches } from '@shared/units/area-depth-units';
import { formatArea, formatDepth, formatVolume } from '@shared/units/format-quantity';
import { fromGallons } from '@shared/units/volume-units';
import { firstValueFrom } from 'rxjs';
import { OrganisationApi } from './organisation-api';

/**
 * How figures are shown: US customary or metric, per the organisation's setting. Values always travel in their
 * base units (gal, ft², mm); only the display converts, and every text carries its unit.
 */
@Injectable({ providedIn: 'root' })
export class UnitSystemStore {
  private readonly api = inject(OrganisationApi);
  private readonly current = signal<UnitSystem>('us');
  private loaded: Promise<void> | null = null;

  readonly system = this.current.asReadonly();
  readonly metric = computed(() => this.current() === 'metric');

  /** Loads the setting once; on failure the US default stays and the next call retries. */
  ensureLoaded(): Promise<void> {
    this.loaded ??= firstValueFrom(this.api.settings()).then(
      (s) => this.current.set(s.unitSystem),
      () => {
        this.loaded = null;
      },
    );
    return this.loaded;
  }

  /** Uses a value the server just sent (e.g. with a budget), so the page never shows mixed units. */
  adopt(system: UnitSystem): void {
    this.current.set(system);
  }

  async change(system: UnitSystem): Promise<void> {
    const saved = await firstValueFrom(this.api.setUnitSystem(system));
    this.current.set(saved.unitSystem);
  }

  volume(gallons: number): string {
    return this.metric() ? formatVolume(fromGallons(gallons, 'm3'), 'm3') : formatVolume(gallons, 'gal');
  }

  area(ft2: number): string {
    return this.metric() ? formatArea(convertArea(ft2, 'ft2', 'm2'), 'm2') : formatArea(ft2, 'ft2');
  }

  depth(mm: number): string {
    return this.metric() ? formatDepth(mm, 'mm') : formatDepth(mmToInches(mm), 'in');
  }

  depthUnit(): 'mm' | 'in' {
    return this.metric() ? 'mm' : 'in';
  }
}
