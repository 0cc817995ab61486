import { AuditEntryEntity } from '../components/audit/data/audit-entry.entity';
import { OrganisationEntity } from '../components/organisations/data/organisation.entity';
import { SiteShareEntity } from '../components/sites/data/site-share.entity';
import { SiteTagEntity } from '../components/sites/data/site-tag.entity';
import { SiteEntity } from '../components/sites/data/site.entity';
import { MembershipEntity } from '../components/users/data/membership.entity';
import { UserTokenEntity } from '../components/users/data/user-token.entity';
import { UserEntity } from '../components/users/data/user.entity';
import { MailMessageEntity } from '../components/mail/data/mail-message.entity';
import { JobLeaseEntity } from '../jobs/job-lease.entity';
import { HydrozoneEntity } from '../components/hydrozones/data/hydrozone.entity';
import { RateScheduleEntity } from '../components/rates/data/rate-schedule.entity';
import { DailyWeatherEntity } from '../components/weather/data/daily-weather.entity';
import { MonthlyWeatherNormalEntity } from '../components/weather/data/monthly-weather-normal.entity';
import { WeatherStationEntity } from '../components/weather/data/weather-station.entity';

/** Every entity, listed once (explicit imports, so bundled builds need no file globbing). */
export const ENTITIES = [
  OrganisationEntity,
  UserEntity,
  MembershipEntity,
  UserTokenEntity,
  SiteEntity,
  SiteTagEntity,
  SiteShareEntity,
  AuditEntryEntity,
  MailMessageEntity,
  JobLeaseEntity,
  WeatherStationEntity,
  DailyWeatherEntity,
  MonthlyWeatherNormalEntity,
  HydrozoneEntity,
  RateScheduleEntity,
];
