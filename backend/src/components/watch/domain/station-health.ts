import { stationGapFinding } from '@shared/watch/station-gap';
import type { Finding } from '@shared/watch/finding';
import { addDays } from '@shared/weather/day-of-year';
import type { DailyWeatherService } from '../../weather/domain/daily-weather-service';
import type { WatchSiteRow } from '../data/watch-data-repository';
import { LOOK_BACK_MS } from './site-watch-input';

/** Days a feed may lag before a station counts as late (common practice, no source). */
export const STATION_LATE_AFTER_DAYS = 2;

/**
 * The watch's weather-health check over the stations of the sites it just checked: one finding per gap in the
 * look-back window, filed on the lowest-numbered site of the station's own organisation that uses it (else the
 * lowest-numbered site), so each gap is one alert for the people who can fill it.
 */
export class StationHealth {
  constructor(private readonly weather: DailyWeatherService) {}

  async findings(sites: readonly WatchSiteRow[], asOf: Date): Promise<Finding[]> {
    const byStation = new Map<number, WatchSiteRow[]>();
    for (const s of sites)
      if (s.weatherStationId !== null)
        byStation.set(s.weatherStationId, [...(byStation.get(s.weatherStationId) ?? []), s]);
    if (byStation.size === 0) return [];
    const to = addDays(asOf.toISOString().slice(0, 10), -STATION_LATE_AFTER_DAYS);
    const from = new Date(asOf.getTime() - LOOK_BACK_MS).toISOString().slice(0, 10);
    const stations = await this.weather.gaps([...byStation.keys()], from, to);
    return stations.flatMap((st) => {
      const using = [...byStation.get(st.stationId)!].sort((a, b) => a.siteId - b.siteId);
      const home = using.find((s) => s.organisationId === st.organisationId) ?? using[0]!;
      return st.gaps.map((gap) =>
        stationGapFinding({
          siteId: String(home.siteId),
          timeZone: home.timeZone,
          station: { id: st.stationId, name: st.stationName },
          gap,
          sitesUsing: using.map((s) => s.name),
        }),
      );
    });
  }
}
