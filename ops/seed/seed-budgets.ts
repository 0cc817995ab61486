import type { DataSource } from 'typeorm';
import { computeDailyEto } from '@shared/weather/daily-eto';
import { addDays } from '@shared/weather/day-of-year';
import { HydrozoneEntity } from '../../backend/src/components/hydrozones/data/hydrozone.entity';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { RateScheduleEntity } from '../../backend/src/components/rates/data/rate-schedule.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { WeatherRepository, type DayToStore } from '../../backend/src/components/weather/data/weather-repository';
import { WeatherStationEntity } from '../../backend/src/components/weather/data/weather-station.entity';
import { inventedDays } from '../weather/invented-weather';
import {
  DEMO_NORMAL_YEARS,
  DEMO_SITE_BUDGETS,
  DEMO_STATIONS,
  DEMO_WEATHER_FROM,
  type DemoStation,
} from './demo-budgets';
import { DEMO_ORGANISATIONS } from './demo-scenario';

/**
 * Writes the demo's weather stations, daily weather (from the fake feed's generator, ETo by FAO-56), normals,
 * hydrozones and rate schedules. Idempotent: rows are matched by their natural keys and brought back to the
 * demo's values. Run after seedDemo (it needs the organisations and sites).
 */
export async function seedBudgets(
  db: DataSource,
  today = new Date().toISOString().slice(0, 10),
): Promise<{ stations: number; days: number; hydrozones: number }> {
  const weather = new WeatherRepository(db);
  const cobalt = await db
    .getRepository(OrganisationEntity)
    .findOneByOrFail({ name: DEMO_ORGANISATIONS.find((o) => o.key === 'cobalt')!.name });
  const stationIds = new Map<string, number>();
  let days = 0;
  for (const s of DEMO_STATIONS) {
    const fields = {
      organisationId: cobalt.id,
      name: s.name,
      latitude: s.latitude,
      longitude: s.longitude,
      elevationM: s.elevationM,
      windHeightM: 2,
      exposure: s.exposure,
      sourceKind: 'feed' as const,
    };
    await db.getRepository(WeatherStationEntity).upsert(fields, ['organisationId', 'name']);
    const station = await db
      .getRepository(WeatherStationEntity)
      .findOneByOrFail({ organisationId: cobalt.id, name: s.name });
    stationIds.set(s.name, station.id);
    const daily = stationDays(s, DEMO_WEATHER_FROM, addDays(today, -1));
    days += daily.length;
    await db.transaction(async (em) => {
      await weather.upsertDays(em, station.id, daily);
      await weather.replaceNormals(em, station.id, normalsOf(s));
    });
  }

  let hydrozones = 0;
  await db.transaction(async (em) => {
    for (const b of DEMO_SITE_BUDGETS) {
      const site = await em.getRepository(SiteEntity).findOneByOrFail({ organisationId: cobalt.id, name: b.site });
      await em.getRepository(SiteEntity).update({ id: site.id }, { weatherStationId: stationIds.get(b.station)! });
      for (const z of b.zones) {
        await em.getRepository(HydrozoneEntity).upsert(
          {
            siteId: site.id,
            name: z.name,
            areaFt2: z.areaFt2,
            plantWaterUse: z.plantWaterUse ?? null,
            plantFactor: z.plantFactor ?? null,
            irrigationMethod: z.irrigationMethod,
            efficiencyOverride: z.efficiencyOverride ?? null,
            specialLandscapeArea: z.specialLandscapeKind !== undefined,
            specialLandscapeKind: z.specialLandscapeKind ?? null,
            designFlowGpm: z.designFlowGpm ?? null,
            emitterCount: z.emitters?.count ?? null,
            emitterGph: z.emitters?.gph ?? null,
            soilIntakeInPerHour: z.soilIntakeInPerHour ?? null,
            notes: z.notes ?? '',
          },
          ['siteId', 'name'],
        );
        hydrozones++;
      }
      await em.getRepository(RateScheduleEntity).upsert(
        {
          siteId: site.id,
          name: b.rate.name,
          unit: b.rate.unit,
          currency: 'USD',
          fixedChargePerPeriod: b.rate.fixedChargePerPeriod,
          structure: JSON.stringify(b.rate.volumeCharge),
          effectiveFrom: '2024-07-01',
        },
        ['siteId', 'effectiveFrom'],
      );
    }
  });
  return { stations: DEMO_STATIONS.length, days, hydrozones };
}

/** The invented feed's days (its deliberate gaps included, so the demo shows filled days) with FAO-56 ETo. */
function stationDays(s: DemoStation, from: string, to: string): DayToStore[] {
  return inventedDays(s.latitude, s.longitude, from, to, { withGaps: true }).map((d) => {
    const observation = {
      date: d.date,
      tMaxC: d.tempHighC,
      tMinC: d.tempLowC,
      rhMaxPct: d.humidityHighPct,
      rhMinPct: d.humidityLowPct,
      windSpeedMs: d.wind2mMs,
      windHeightM: 2,
      solarRadiationMj: d.solarMj,
    };
    const eto = computeDailyEto(observation, {
      latitudeDeg: s.latitude,
      elevationM: s.elevationM,
      exposure: s.exposure,
    });
    return {
      date: d.date,
      etoMm: Math.round(eto.etoMm * 100) / 100,
      rainMm: d.rainMm,
      method: eto.method,
      source: 'feed',
      observations: JSON.stringify(observation),
    };
  });
}

/** Monthly normals: the mean monthly totals of the generator over DEMO_NORMAL_YEARS. */
function normalsOf(s: DemoStation): { month: number; etoMm: number; rainMm: number }[] {
  const sums = Array.from({ length: 12 }, () => ({ etoMm: 0, rainMm: 0 }));
  for (const year of DEMO_NORMAL_YEARS) {
    for (const d of stationDays({ ...s }, `${year}-01-01`, `${year}-12-31`)) {
      const m = Number(d.date.slice(5, 7)) - 1;
      sums[m]!.etoMm += d.etoMm ?? 0;
      sums[m]!.rainMm += d.rainMm ?? 0;
    }
  }
  return sums.map((t, i) => ({
    month: i + 1,
    etoMm: Math.round((t.etoMm / DEMO_NORMAL_YEARS.length) * 10) / 10,
    rainMm: Math.round((t.rainMm / DEMO_NORMAL_YEARS.length) * 10) / 10,
  }));
}
