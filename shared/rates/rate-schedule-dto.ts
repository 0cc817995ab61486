import type { RateSchedule } from './rate-schedule';

export const RATE_SCHEDULE_LIMITS = { nameMax: 120, tiersMax: 10, currencyPattern: /^[A-Z]{3}$/ } as const;

/** A site's rate schedule as the API returns it; it applies from `effectiveFrom` until a later one starts. */
export interface RateScheduleDto extends RateSchedule {
  id: number;
  siteId: number;
  effectiveFrom: string;
  updatedAt: string;
}

export interface RateScheduleInput extends RateSchedule {
  effectiveFrom: string;
}
