import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { HttpErrorResponse } from '@angular/common/http';
import { WEATHER_FILE_COLUMNS } from '@shared/weather/daily-weather-rows';
import {
  DAILY_WEATHER_METHOD_LABELS,
  type DailyWeatherMethod,
  type WeatherImportReport,
  type WeatherUploadFormat,
} from '@shared/weather/weather-station-dto';
import type { ApiErrorBody } from '@shared/api/errors';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { WeatherApi } from '../weather-api';

/** Upload a daily-weather CSV or pull days from the feed; shows what was written, or every bad row. */
@Component({
  selector: 'rm-weather-import',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './weather-import.html',
  styleUrl: './weather-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeatherImport {
  private readonly api = inject(WeatherApi);
  readonly stationId = input.required<number>();
  /** Emitted after anything was written, so the page reloads its chart. */
  readonly imported = output<void>();

  protected readonly columns = WEATHER_FILE_COLUMNS;
  protected readonly methodLabels = DAILY_WEATHER_METHOD_LABELS;
  protected format: WeatherUploadFormat = 'eto-rain';
  protected file: File | null = null;
  protected fetchFrom = new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10);
  protected fetchTo = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  protected readonly busy = signal(false);
  protected readonly report = signal<WeatherImportReport | null>(null);
  protected readonly problem = signal<{ message: string; rows: { field: string; message: string }[] } | null>(null);

  protected pickFile(event: Event): void {
    this.file = (event.target as HTMLInputElement).files?.[0] ?? null;
  }

  protected methodsOf(report: WeatherImportReport): string {
    return Object.entries(report.methods)
      .map(([m, n]) => `${this.methodLabels[m as DailyWeatherMethod]}: ${n}`)
      .join(' · ');
  }

  protected async upload(): Promise<void> {
    if (!this.file) return;
    await this.run(() => firstValueFrom(this.api.upload(this.stationId(), this.format, this.file!)));
  }

  protected async fetchFeed(): Promise<void> {
    await this.run(() => firstValueFrom(this.api.fetchFromFeed(this.stationId(), this.fetchFrom, this.fetchTo)));
  }

  private async run(action: () => Promise<WeatherImportReport>): Promise<void> {
    this.busy.set(true);
    this.report.set(null);
    this.problem.set(null);
    try {
      this.report.set(await action());
      this.imported.emit();
    } catch (err) {
      const body = err instanceof HttpErrorResponse ? (err.error as ApiErrorBody | null) : null;
      this.problem.set({
        message: describeApiError(err, 'Nothing was stored.').message,
        rows: body?.error?.details ?? [],
      });
    } finally {
      this.busy.set(false);
    }
  }
}
