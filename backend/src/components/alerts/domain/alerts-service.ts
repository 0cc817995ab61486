import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import { KIND_LABELS } from '@shared/alerts/alert-dto';
import type { FindingKind } from '@shared/watch/finding';
import type {
  AlertDetailDto,
  AlertEventDto,
  AlertListFilter,
  AlertSummaryDto,
  NotificationPreferenceDto,
} from '@shared/alerts/alert-dto';
import { atLeast, siteLevel } from '@shared/auth/roles';
import { addMonths } from '@shared/portfolio/period';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { AlertFiguresRepository } from '../data/alert-figures-repository';
import type { AlertMailRepository } from '../data/alert-mail-repository';
import type { AlertsRepository } from '../data/alerts-repository';

/**
 * Alerts as people see and handle them. Anyone who can see the site reads its alerts; acting on one needs
 * 'contribute' (managers and contractors of the owner, contractors of a contributing share); auditors read only.
 */
export class AlertsService {
  constructor(
    private readonly db: DataSource,
    private readonly alerts: AlertsRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
    private readonly figures: AlertFiguresRepository,
    private readonly mail: AlertMailRepository,
  ) {}

  /** Unresolved alerts per site over every site the organisation sees; the caller keeps the ones in scope. */
  openCountsVisibleTo(organisationId: number): Promise<Map<number, number>> {
    return this.figures.openAlerts(organisationId);
  }

  /** One site's alerts by local start day, as chart markers (the caller has checked access to the site). */
  async markers(
    siteId: number,
    timeZone: string,
    from: string,
    to: string,
  ): Promise<{ id: number; date: string; title: string; status: string }[]> {
    // The stored kind is a code; markers carry the kind's name as people read it.
    const markers = await this.figures.alertMarkers(siteId, timeZone, from, to);
    return markers.map((m) => ({ ...m, title: KIND_LABELS[m.title as FindingKind] ?? m.title }));
  }

  /** Per site, alerts touching a local month and how many are still open (the caller has checked the sites). */
  monthCounts(siteIds: number[], month: string): Promise<Map<number, { inMonth: number; open: number }>> {
    return this.figures.monthCounts(siteIds, month, addMonths(month, 1));
  }

  /**
   * One site's alerts of a local month with what people did about them (acknowledged, resolved, notes), for the
   * board packet; the caller has checked access to the site.
   */
  async monthAlerts(siteId: number, month: string): Promise<(AlertSummaryDto & { events: AlertEventDto[] })[]> {
    const alerts = await this.alerts.inMonth(siteId, month, addMonths(month, 1));
    return Promise.all(alerts.map(async (a) => ({ ...a, events: await this.alerts.events(a.id) })));
  }

  /** Whether the alert table is there to read. */
  tableAvailable(): Promise<boolean> {
    return this.figures.alertsAvailable();
  }

  async list(principal: Principal, filter: AlertListFilter): Promise<Page<AlertSummaryDto>> {
    if (filter.siteId) await this.sites.requireLevel(principal, filter.siteId, 'read');
    const { items, total } = await this.alerts.list(principal.organisationId, filter);
    return { items, total, page: filter.page, pageSize: filter.pageSize };
  }

  async get(principal: Principal, id: number): Promise<AlertDetailDto> {
    const alert = await this.alerts.findVisible(principal.organisationId, id);
    if (!alert) throw AppError.notFound('Alert');
    const site = await this.sites.requireLevel(principal, alert.siteId, 'read');
    return {
      ...alert,
      events: await this.alerts.events(id),
      canAct: atLeast(siteLevel(principal.role, site.relation), 'contribute'),
    };
  }

  acknowledge(principal: Principal, id: number, note: string | undefined): Promise<AlertDetailDto> {
    return this.act(principal, id, 'acknowledged', note);
  }

  resolve(principal: Principal, id: number, note: string | undefined): Promise<AlertDetailDto> {
    return this.act(principal, id, 'resolved', note);
  }

  addNote(principal: Principal, id: number, note: string): Promise<AlertDetailDto> {
    return this.act(principal, id, 'note', note);
  }

  private async act(
    principal: Principal,
    id: number,
    action: 'acknowledged' | 'resolved' | 'note',
    note: string | undefined,
  ): Promise<AlertDetailDto> {
    const alert = await this.alerts.findVisible(principal.organisationId, id);
    if (!alert) throw AppError.notFound('Alert');
    const site = await this.sites.requireLevel(principal, alert.siteId, 'contribute');
    if (action === 'acknowledged' && alert.status !== 'open')
      throw new AppError('conflict', `This alert is ${alert.status} already.`);
    if (action === 'resolved' && alert.status === 'resolved')
      throw new AppError('conflict', 'This alert is resolved already.');
    await this.db.transaction(async (em) => {
      if (action !== 'note') await this.alerts.setStatus(em, id, action);
      await this.alerts.addEvent(em, id, principal.userId, action, note?.trim() || null);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'alert',
        entityId: id,
        action: action === 'note' ? 'note' : action,
        changes: { note: note ?? null },
      });
    });
    return this.get(principal, id);
  }

  notificationPreference(principal: Principal): Promise<NotificationPreferenceDto> {
    return this.mail.preference(principal.userId);
  }

  async setNotificationPreference(
    principal: Principal,
    pref: NotificationPreferenceDto,
  ): Promise<NotificationPreferenceDto> {
    if (pref.siteIds) for (const siteId of pref.siteIds) await this.sites.requireLevel(principal, siteId, 'read');
    await this.mail.savePreference(principal.userId, pref);
    return this.notificationPreference(principal);
  }
}
