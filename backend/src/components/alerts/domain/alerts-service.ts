import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import { KIND_LABELS } from '@shared/alerts/alert-dto';
import type { FindingKind } from '@shared/watch/finding';
import type {
  AlertDetailDto,
  AlertEventDto,
  AlertListFilter,
  AlertResolution,
  AlertSummaryDto,
  NotificationPreferenceDto,
  RepairTimesDto,
} from '@shared/alerts/alert-dto';
import { repairTimes } from '@shared/alerts/repair-times';
import type { RuleWorklistRow } from '@shared/watering-rules/rules-dto';
import { localMidnightUtc, nextDate } from '@shared/watch/site-clock';
import { repairVerifiable } from '@shared/watch/repair-check';
import { atLeast, siteLevel } from '@shared/auth/roles';
import { addMonths } from '@shared/portfolio/period';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { AlertFiguresRepository } from '../data/alert-figures-repository';
import type { AlertMailRepository } from '../data/alert-mail-repository';
import type { AlertRepairsRepository } from '../data/alert-repairs-repository';
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
    private readonly repairs: AlertRepairsRepository,
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
      ...(await this.repairs.verificationOf(id)),
      events: await this.alerts.events(id),
      canAct: atLeast(siteLevel(principal.role, site.relation), 'contribute'),
    };
  }

  acknowledge(principal: Principal, id: number, note: string | undefined): Promise<AlertDetailDto> {
    return this.act(principal, id, 'acknowledged', note);
  }

  /**
   * Resolves an alert. "fixed" records the repair's day (default: now) and, for conditions the meter or the log can
   * confirm, asks the watch to check the nights after it.
   */
  async resolve(
    principal: Principal,
    id: number,
    input: { note?: string | undefined; resolution?: AlertResolution | undefined; repairedOn?: string | undefined },
  ): Promise<AlertDetailDto> {
    const alert = await this.alerts.findVisible(principal.organisationId, id);
    if (!alert) throw AppError.notFound('Alert');
    const site = await this.sites.requireLevel(principal, alert.siteId, 'contribute');
    if (alert.status === 'resolved') throw new AppError('conflict', 'This alert is resolved already.');
    const repairedAt = repairMoment(input.repairedOn, site.timeZone, new Date(alert.firstDetectedAt));
    const resolution = input.resolution ?? null;
    const watch = resolution === 'fixed' && repairVerifiable(alert.subKind, alert.zoneId);
    await this.db.transaction(async (em) => {
      await this.repairs.resolve(em, id, {
        resolution,
        repairedAt,
        resolvedBy: principal.userId,
        resolverOrganisationId: principal.organisationId,
        watch,
      });
      await this.alerts.addEvent(em, id, principal.userId, 'resolved', input.note?.trim() || null);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'alert',
        entityId: id,
        action: 'resolved',
        changes: { note: input.note ?? null, resolution, repairedAt: repairedAt.toISOString() },
      });
    });
    return this.get(principal, id);
  }

  /** The watch's rule-breach alerts of a month on these sites (the caller chose sites its organisation sees). */
  ruleBreachesVisibleTo(organisationId: number, siteIds: number[], month: string): Promise<RuleWorklistRow[]> {
    return this.repairs.ruleBreaches(organisationId, siteIds, month);
  }

  /** Time from alert to verified repair per site and per who resolved it, for alerts first seen in [from, to]. */
  async repairTimes(principal: Principal, from: string, to: string): Promise<RepairTimesDto> {
    if (to < from) throw AppError.invalid('to', 'must be on or after from');
    const rows = await this.repairs.repairs(
      principal.organisationId,
      new Date(`${from}T00:00:00Z`),
      new Date(Date.parse(`${to}T00:00:00Z`) + 86_400_000),
    );
    return {
      from,
      to,
      bySite: repairTimes(rows.map((r) => ({ ...r, key: String(r.siteId), label: r.siteName }))),
      byResolver: repairTimes(
        rows.map((r) => ({ ...r, key: `${r.resolverOrg}|${r.resolver}`, label: `${r.resolver} (${r.resolverOrg})` })),
      ),
    };
  }

  addNote(principal: Principal, id: number, note: string): Promise<AlertDetailDto> {
    return this.act(principal, id, 'note', note);
  }

  private async act(
    principal: Principal,
    id: number,
    action: 'acknowledged' | 'note',
    note: string | undefined,
  ): Promise<AlertDetailDto> {
    const alert = await this.alerts.findVisible(principal.organisationId, id);
    if (!alert) throw AppError.notFound('Alert');
    const site = await this.sites.requireLevel(principal, alert.siteId, 'contribute');
    if (action === 'acknowledged' && alert.status !== 'open')
      throw new AppError('conflict', `This alert is ${alert.status} already.`);
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

/**
 * The repair's moment: the end of the local day the person named (only nights after it count), else now. A day in
 * the future or before the alert was first seen is an error.
 */
function repairMoment(repairedOn: string | undefined, timeZone: string, firstDetected: Date): Date {
  const now = new Date();
  if (!repairedOn) return now;
  const end = localMidnightUtc(nextDate(repairedOn), timeZone);
  if (localMidnightUtc(repairedOn, timeZone) > now.getTime()) throw AppError.invalid('repairedOn', 'is in the future');
  if (end <= firstDetected.getTime() - 86_400_000)
    throw AppError.invalid('repairedOn', 'is before the alert was first seen');
  return new Date(Math.min(end, now.getTime()));
}
