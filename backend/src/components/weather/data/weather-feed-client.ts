import { z } from 'zod';
import type { DailyWeatherObservation } from '@shared/weather/daily-eto';
import { AppError } from '../../../platform/app-error';

/** One day from the feed: the observations Rillmark computes ETo from, plus rain. */
export interface FeedDay {
  observation: DailyWeatherObservation;
  rainMm: number | null;
}

const daySchema = z.object({
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  tempHighC: z.number(),
  tempLowC: z.number(),
  humidityHighPct: z.number().optional(),
  humidityLowPct: z.number().optional(),
  wind2mMs: z.number().optional(),
  solarMj: z.number().optional(),
  rainMm: z.number().nullable().optional(),
});
const responseSchema = z.object({ days: z.array(daySchema) });

/**
 * Client of the hosted weather feed (plain HTTP + JSON at RILLMARK_WEATHER_FEED_URL; in development and tests,
 * ops/weather/fake-weather-server.ts). Anything unexpected becomes one clear `upstream_unavailable` error.
 */
export class WeatherFeedClient {
  constructor(
    private readonly baseUrl: string,
    private readonly timeoutMs: number,
  ) {}

  async dailyObservations(latitude: number, longitude: number, from: string, to: string): Promise<FeedDay[]> {
    const query = new URLSearchParams({ lat: String(latitude), lon: String(longitude), from, to });
    const url = `${this.baseUrl}/daily-observations?${query}`;
    let response: Response;
    try {
      response = await fetch(url, {
        signal: AbortSignal.timeout(this.timeoutMs),
        headers: { accept: 'application/json' },
      });
    } catch (error) {
      throw new AppError(
        'upstream_unavailable',
        `The weather feed at ${this.baseUrl} did not answer (${(error as Error).message}).`,
      );
    }
    const body: unknown = await response.json().catch(() => null);
    if (!response.ok) {
      const said = (body as { problem?: unknown } | null)?.problem;
      throw new AppError(
        'upstream_unavailable',
        `The weather feed refused the request (${response.status}${typeof said === 'string' ? `: ${said}` : ''}).`,
      );
    }
    const parsed = responseSchema.safeParse(body);
    if (!parsed.success)
      throw new AppError('upstream_unavailable', 'The weather feed answered in an unexpected shape.');
    return parsed.data.days.map((d) => ({
      rainMm: d.rainMm ?? null,
      observation: {
        date: d.date,
        tMaxC: d.tempHighC,
        tMinC: d.tempLowC,
        rhMaxPct: d.humidityHighPct,
        rhMinPct: d.humidityLowPct,
        windSpeedMs: d.wind2mMs,
        // The feed reports wind already at 2 m, whatever the station's own anemometer height.
        windHeightM: d.wind2mMs === undefined ? undefined : 2,
        solarRadiationMj: d.solarMj,
      },
    }));
  }
}
