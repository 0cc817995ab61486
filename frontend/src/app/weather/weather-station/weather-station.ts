import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import {
  DAILY_WEATHER_METHOD_LABELS,
  type DailyWeatherMethod,
  type MonthlyNormalDto,
} from '@shared/weather/weather-station-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { NormalsEditor } from '../normals-editor/normals-editor';
import { editStation } from '../station-form/station-form';
import { WeatherApi } from '../weather-api';
import { WeatherChart } from '../weather-chart/weather-chart';
import { WeatherImport } from '../weather-import/weather-import';

const isoDaysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);

/** `/weather-stations/:id`: a station's daily ETo and rain, where they came from, imports and normals. */
@Component({
  selector: 'rm-weather-station',
  imports: [
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    WeatherChart,
    WeatherImport,
    NormalsEditor,
  ],
  templateUrl: './weather-station.html',
  styleUrl: './weather-station.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeatherStation {
  private readonly api = inject(WeatherApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly units = inject(UnitSystemStore);

  readonly id = input.required<string>();
  protected readonly stationId = computed(() => Number(this.id()));
  protected readonly from = signal(isoDaysAgo(120));
  protected readonly to = signal(isoDaysAgo(1));

  protected readonly station = rxResource({
    params: () => this.stationId(),
    stream: ({ params }) => this.api.get(params),
  });
  protected readonly series = rxResource({
    params: () => ({ id: this.stationId(), from: this.from(), to: this.to() }),
    stream: ({ params }) => this.api.daily(params.id, params.from, params.to),
  });
  protected readonly normals = rxResource({
    params: () => this.stationId(),
    stream: ({ params }) => this.api.normals(params),
  });

  protected readonly loadError = computed(() => {
    const err = this.station.error();
    return err ? describeApiError(err, 'The station could not be loaded.').message : null;
  });
  protected readonly seriesError = computed(() => {
    const err = this.series.error();
    return err ? describeApiError(err, 'The weather could not be loaded.').message : null;
  });
  /** "Penman–Monteith (FAO-56): 80 · Filled from monthly normals: 2" and the same for sources. */
  protected readonly breakdown = computed(() => {
    if (!this.series.hasValue()) return { methods: '', sources: '' };
    const days = this.series.value().days;
    const count = (key: (d: { method: DailyWeatherMethod; source: string }) => string) => {
      const map = new Map<string, number>();
      for (const d of days) map.set(key(d), (map.get(key(d)) ?? 0) + 1);
      return [...map.entries()].map(([k, n]) => `${k}: ${n}`).join(' · ');
    };
    return { methods: count((d) => DAILY_WEATHER_METHOD_LABELS[d.method]), sources: count((d) => d.source) };
  });

  constructor() {
    void this.units.ensureLoaded();
  }

  protected setDate(which: 'from' | 'to', value: string): void {
    if (/^\d{4}-\d{2}-\d{2}$/.test(value)) this[which].set(value);
  }

  protected refresh(): void {
    this.series.reload();
    this.station.reload();
  }

  protected async editStation(): Promise<void> {
    if (!this.station.hasValue()) return;
    if (await editStation(this.dialog, this.station.value())) this.station.reload();
  }

  protected async saveNormals(normals: MonthlyNormalDto[]): Promise<void> {
    try {
      await firstValueFrom(this.api.saveNormals(this.stationId(), normals));
      this.normals.reload();
      this.series.reload();
      this.snackBar.open('Normals saved.', undefined, { duration: 3000 });
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The normals could not be saved.').message, 'Close');
    }
  }
}
