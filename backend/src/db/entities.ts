import { AlertEntity } from '../components/alerts/data/alert.entity';
import { AlertEventEntity } from '../components/alerts/data/alert-event.entity';
import { UserNotificationEntity } from '../components/alerts/data/user-notification.entity';
import { WatchRunEntity } from '../components/watch/data/watch-run.entity';
import { WatchSiteStateEntity } from '../components/watch/data/watch-site-state.entity';
import { SiteWatchSettingsEntity } from '../components/watch/data/site-watch-settings.entity';
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
import { SiteDailyUseEntity } from '../components/readings/data/site-daily-use.entity';
import { HydrozoneEntity } from '../components/hydrozones/data/hydrozone.entity';
import { RateScheduleEntity } from '../components/rates/data/rate-schedule.entity';
import { DailyWeatherEntity } from '../components/weather/data/daily-weather.entity';
import { MonthlyWeatherNormalEntity } from '../components/weather/data/monthly-weather-normal.entity';
import { WeatherStationEntity } from '../components/weather/data/weather-station.entity';

import { ApiKeySiteEntity } from '../components/api-keys/data/api-key-site.entity';
import { ApiKeyEntity } from '../components/api-keys/data/api-key.entity';
import { ControllerEntity } from '../components/meters/data/controller.entity';
import { MeterReadingEntity } from '../components/readings/data/meter-reading.entity';
import { MeterRegisterPeriodEntity } from '../components/meters/data/meter-register-period.entity';
import { MeterRegisterReadEntity } from '../components/readings/data/meter-register-read.entity';
import { MeterEntity } from '../components/meters/data/meter.entity';
import { RuntimeEventEntity } from '../components/meters/data/runtime-event.entity';
import { ZoneEntity } from '../components/meters/data/zone.entity';
import { ImportProfileEntity } from '../components/uploads/data/import-profile.entity';
import { UploadRejectionEntity } from '../components/uploads/data/upload-rejection.entity';
import { UploadReplacementEntity } from '../components/uploads/data/upload-replacement.entity';
import { UploadEntity } from '../components/uploads/data/upload.entity';
import { UploadSiteEntity } from '../components/uploads/data/upload-site.entity';
import { UploadConflictEntity } from '../components/uploads/data/upload-conflict.entity';
import { MeterBillingPeriodEntity } from '../components/readings/data/meter-billing-period.entity';
import { SavingsProjectEntity } from '../components/savings/data/savings-project.entity';
import { ComplianceNoticeEntity } from '../components/reports/data/compliance-notice.entity';
import { FieldAuditEntity } from '../components/field-audits/data/field-audit.entity';
import { FieldAuditFaultEntity } from '../components/field-audits/data/field-audit-fault.entity';
import { FieldAuditPhotoEntity } from '../components/field-audits/data/field-audit-photo.entity';
import { FieldAuditZoneTestEntity } from '../components/field-audits/data/field-audit-zone-test.entity';
import { WhatIfPlanEntity } from '../components/planner/data/what-if-plan.entity';
import { SiteEtafSettingEntity } from '../components/etaf/data/site-etaf-setting.entity';
import { BoardPacketEntity } from '../components/month-close/data/board-packet.entity';
import { SiteMonthReviewEntity } from '../components/month-close/data/site-month-review.entity';
import { WateringRuleEntity, WateringRuleSiteEntity } from '../components/watering-rules/data/watering-rule.entity';
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
  SiteDailyUseEntity,
  WeatherStationEntity,
  DailyWeatherEntity,
  MonthlyWeatherNormalEntity,
  HydrozoneEntity,
  RateScheduleEntity,
  // Ingest (meters, controllers, uploads, API keys)
  MeterEntity,
  MeterRegisterPeriodEntity,
  MeterReadingEntity,
  MeterRegisterReadEntity,
  MeterBillingPeriodEntity,
  ControllerEntity,
  ZoneEntity,
  RuntimeEventEntity,
  UploadEntity,
  UploadSiteEntity,
  UploadConflictEntity,
  UploadRejectionEntity,
  UploadReplacementEntity,
  ImportProfileEntity,
  ApiKeyEntity,
  ApiKeySiteEntity,
  // Reports (savings projects, compliance notices)
  SavingsProjectEntity,
  ComplianceNoticeEntity,
  // Month close (review marks, board packets)
  SiteMonthReviewEntity,
  BoardPacketEntity,
  // Nightly watch (alerts, runs, settings, notification preferences)
  AlertEntity,
  AlertEventEntity,
  UserNotificationEntity,
  WatchRunEntity,
  WatchSiteStateEntity,
  SiteWatchSettingsEntity,
  // Field work (irrigation audits, what-if plans, allowed ETAF per site)
  FieldAuditEntity,
  FieldAuditZoneTestEntity,
  FieldAuditFaultEntity,
  FieldAuditPhotoEntity,
  WhatIfPlanEntity,
  SiteEtafSettingEntity,
  // Watering rules by stage and the sites under them
  WateringRuleEntity,
  WateringRuleSiteEntity,
];
