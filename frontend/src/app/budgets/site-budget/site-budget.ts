import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { atLeast } from '@shared/auth/roles';
import type { RainCreditKind, UnitSystem } from '@shared/budgets/budget-dto';
import type { MweloProjectType } from '@shared/budgets/mwelo-allowance';
import { firstValueFrom } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { SitesApi } from '../../sites/sites-api';
import { WeatherApi } from '../../weather/weather-api';
import { BudgetsApi } from '../budgets-api';
import { BudgetTable } from '../budget-table/budget-table';
import { ComplianceCard } from '../compliance-card/compliance-card';

const monthOffset = (months: number) => {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + months, 1)).toISOString().slice(0, 7);
};

/** `/sites/:id/budget`: monthly budget with its working, the site's weather station, and the MWELO check. */
@Component({
  selector: 'rm-site-budget',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    BudgetTable,
    ComplianceCard,
  ],
  templateUrl: './site-budget.html',
  styleUrl: './site-budget.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteBudget {
  private readonly api = inject(BudgetsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly weatherApi = inject(WeatherApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly units = inject(UnitSystemStore);
  protected readonly auth = inject(AuthStore);

  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));

  protected readonly from = signal(monthOffset(-12));
  protected readonly to = signal(monthOffset(-1));
  protected readonly rain = signal<RainCreditKind>('none');
  protected readonly occupants = signal<number | null>(null);
  protected readonly gallonsPerPerson = signal<number | null>(null);
  private readonly indoor = computed(() => {
    const occupants = this.occupants();
    const gpcd = this.gallonsPerPerson();
    return occupants !== null && gpcd !== null ? { occupants, gallonsPerPersonPerDay: gpcd } : null;
  });
  protected readonly year = signal(new Date().getUTCFullYear() - 1);
  protected readonly projectType = signal<MweloProjectType | null>(null);
  protected readonly countRain = signal(false);
  protected readonly years = Array.from({ length: 6 }, (_, i) => new Date().getUTCFullYear() - i);

  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly station = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.weatherApi.stationOfSite(params),
  });
  protected readonly stations = rxResource({ stream: () => this.weatherApi.list() });
  protected readonly budget = rxResource({
    params: () => ({
      siteId: this.siteId(),
      from: this.from(),
      to: this.to(),
      rain: this.rain(),
      indoor: this.indoor(),
      linked: this.station.value()?.station?.id,
    }),
    stream: ({ params }) => this.api.budget(params.siteId, params),
  });
  protected readonly compliance = rxResource({
    params: () => ({
      siteId: this.siteId(),
      year: this.year(),
      type: this.projectType(),
      rain: this.countRain(),
      linked: this.station.value()?.station?.id,
    }),
    stream: ({ params }) => this.api.compliance(params.siteId, params.year, params.type, params.rain),
  });

  protected readonly canLink = computed(() =>
    atLeast(this.site.hasValue() ? this.site.value().access : 'read', 'contribute'),
  );
  protected readonly budgetError = computed(() => {
    const err = this.budget.error();
    return err ? describeApiError(err, 'The budget could not be computed.').message : null;
  });
  protected readonly complianceError = computed(() => {
    const err = this.compliance.error();
    return err ? describeApiError(err, 'The compliance check could not be computed.').message : null;
  });

  constructor() {
    // The budget says which units the organisation uses; the rest of the page follows it.
    effect(() => {
      if (this.budget.hasValue()) this.units.adopt(this.budget.value().unitSystem);
    });
  }

  protected setMonth(which: 'from' | 'to', value: string): void {
    if (/^\d{4}-\d{2}$/.test(value)) this[which].set(value);
  }

  /** Blank clears the figure; only whole, non-negative numbers count. */
  protected setIndoor(which: 'occupants' | 'gallonsPerPerson', value: string): void {
    const n = value.trim() === '' ? null : Number(value);
    this[which].set(n !== null && Number.isFinite(n) && n >= 0 ? n : null);
  }

  protected async linkStation(stationId: number | null): Promise<void> {
    try {
      await firstValueFrom(this.weatherApi.linkSite(this.siteId(), stationId));
      this.station.reload();
      this.snackBar.open('Weather station changed.', undefined, { duration: 3000 });
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The station could not be linked.').message, 'Close');
    }
  }

  protected async changeUnits(system: UnitSystem): Promise<void> {
    try {
      await this.units.change(system);
      this.budget.reload();
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The unit setting could not be saved.').message, 'Close');
    }
  }
}
