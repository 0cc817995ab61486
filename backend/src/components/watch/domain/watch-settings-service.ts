import type { DataSource } from 'typeorm';
import { DEFAULT_THRESHOLDS, resolveThresholds, type ThresholdName } from '@shared/watch/alert-thresholds';
import { DEFAULT_IRRIGATION_WINDOW, type WatchSettingsDto, type WatchSettingsInput } from '@shared/watch/watch-dto';
import { atLeast, siteLevel } from '@shared/auth/roles';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { WatchDataRepository } from '../data/watch-data-repository';

/** A site's watch thresholds and irrigation window: read at 'read', changed at 'edit'. */
export class WatchSettingsService {
  constructor(
    private readonly db: DataSource,
    private readonly data: WatchDataRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async get(principal: Principal, siteId: number): Promise<WatchSettingsDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const saved = (await this.data.settingsOf([siteId])).get(siteId);
    const overrides = saved?.thresholds ?? {};
    return {
      siteId,
      irrigationWindow: saved
        ? { startHour: saved.irrigationStartHour, endHour: saved.irrigationEndHour }
        : { ...DEFAULT_IRRIGATION_WINDOW },
      thresholds: (Object.keys(DEFAULT_THRESHOLDS) as ThresholdName[]).map((name) => ({
        name,
        value: overrides[name] ?? DEFAULT_THRESHOLDS[name].value,
        defaultValue: DEFAULT_THRESHOLDS[name].value,
        unit: DEFAULT_THRESHOLDS[name].unit,
        explanation: DEFAULT_THRESHOLDS[name].explanation,
        overridden: overrides[name] !== undefined,
      })),
      canEdit: atLeast(siteLevel(principal.role, site.relation), 'edit'),
    };
  }

  async update(principal: Principal, siteId: number, input: WatchSettingsInput): Promise<WatchSettingsDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'edit');
    try {
      resolveThresholds(input.thresholds);
    } catch (err) {
      throw AppError.invalid('thresholds', (err as Error).message);
    }
    // Only real differences from the defaults are kept, so later changes to a default reach the site.
    const overrides = Object.fromEntries(
      Object.entries(input.thresholds).filter(([name, v]) => DEFAULT_THRESHOLDS[name as ThresholdName]?.value !== v),
    );
    const window = input.irrigationWindow ?? DEFAULT_IRRIGATION_WINDOW;
    await this.db.transaction(async (em) => {
      await em.query(
        `INSERT INTO site_watch_settings (site_id, thresholds, irrigation_start_hour,
          irrigation_end_hour, updated_by) VALUES (?, ?, ?, ?, ?)
         ON DUPLICATE KEY UPDATE thresholds = VALUES(thresholds), irrigation_start_hour = VALUES(irrigation_start_hour),
         irrigation_end_hour = VALUES(irrigation_end_hour), updated_by = VALUES(updated_by)`,
        [siteId, JSON.stringify(overrides), window.startHour, window.endHour, principal.userId],
      );
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site_watch_settings',
        entityId: siteId,
        action: 'update',
        changes: { thresholds: overrides, irrigationWindow: window },
      });
    });
    return this.get(principal, siteId);
  }
}
