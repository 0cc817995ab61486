import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { RuleWorklistDto } from '@shared/watering-rules/rules-dto';
import type { SiteRule, WateringRuleDto, WateringRuleInput } from '@shared/watering-rules/watering-rule';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AlertsService } from '../../alerts/domain/alerts-service';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { RuleSort, WateringRulesRepository } from '../data/watering-rules-repository';

/** Conservation work is for administrators, managers and auditors (the agency's officers); contractors get 403. */
const RULE_ROLES = new Set(['admin', 'manager', 'auditor']);

/**
 * Watering rules as an agency (or a manager under one) records them, and the worklist of sites that watered outside
 * them. Rules belong to the organisation that entered them; a site can be put under a rule only by someone who sees
 * the site. The nightly watch reads every rule a site is under (`siteRules`) and files the breaches as alerts.
 */
export class WateringRulesService {
  constructor(
    private readonly db: DataSource,
    private readonly rules: WateringRulesRepository,
    private readonly sites: SitesService,
    private readonly alerts: AlertsService,
    private readonly audit: AuditRepository,
  ) {}

  /** For the watch: every stage of every rule the site is under. */
  siteRules(siteId: number): Promise<SiteRule[]> {
    return this.rules.siteRules(siteId);
  }

  async list(
    principal: Principal,
    q: { page: number; pageSize: number; sort: RuleSort; dir: 'asc' | 'desc'; q?: string | undefined },
  ): Promise<Page<WateringRuleDto>> {
    requireRole(principal);
    const { items, total } = await this.rules.list(principal.organisationId, q);
    return { items, total, page: q.page, pageSize: q.pageSize };
  }

  async get(principal: Principal, id: number): Promise<WateringRuleDto> {
    requireRole(principal);
    const rule = await this.rules.get(principal.organisationId, id);
    if (!rule) throw AppError.notFound('Watering rule');
    return rule;
  }

  async create(principal: Principal, input: WateringRuleInput): Promise<WateringRuleDto> {
    requireRole(principal);
    await this.checkInput(principal, input);
    const id = await this.db.transaction(async (em) => {
      const created = await this.rules.insert(em, principal.organisationId, principal.userId, input);
      await this.record(em, principal, created, 'create', input);
      return created;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, id: number, input: WateringRuleInput): Promise<WateringRuleDto> {
    await this.get(principal, id);
    await this.checkInput(principal, input);
    await this.db.transaction(async (em) => {
      await this.rules.update(em, id, principal.userId, input);
      await this.record(em, principal, id, 'update', input);
    });
    return this.get(principal, id);
  }

  async remove(principal: Principal, id: number): Promise<void> {
    const rule = await this.get(principal, id);
    await this.db.transaction(async (em) => {
      await this.rules.remove(em, id);
      await this.record(em, principal, id, 'delete', { name: rule.name, stage: rule.stage });
    });
  }

  /** Sites under the organisation's rules that watered outside them in the month, from the watch's alerts. */
  async worklist(principal: Principal, q: { month: string; page: number; pageSize: number }): Promise<RuleWorklistDto> {
    requireRole(principal);
    const siteIds = [...new Set(await this.rules.siteIdsOf(principal.organisationId))];
    const rows = await this.alerts.ruleBreachesVisibleTo(principal.organisationId, siteIds, q.month);
    const items = rows.slice(q.page * q.pageSize, (q.page + 1) * q.pageSize);
    return {
      items,
      total: rows.length,
      page: q.page,
      pageSize: q.pageSize,
      month: q.month,
      sitesUnderRules: siteIds.length,
    };
  }

  private async checkInput(principal: Principal, input: WateringRuleInput): Promise<void> {
    if (input.inForceTo !== null && input.inForceTo < input.inForceFrom)
      throw AppError.invalid('inForceTo', 'must be on or after the first day in force');
    if (input.allowedHours.startHour === input.allowedHours.endHour)
      throw AppError.invalid('allowedHours', 'must not start and end at the same hour');
    if (input.dayMode === 'weekdays' && input.weekdays.length === 0)
      throw AppError.invalid('weekdays', 'choose at least one watering day');
    const seen = new Set<number>();
    for (const s of input.sites) {
      if (seen.has(s.siteId)) throw AppError.invalid('sites', `site ${s.siteId} is listed twice`);
      seen.add(s.siteId);
      await this.sites.requireLevel(principal, s.siteId, 'read');
    }
  }

  private record(
    em: Parameters<AuditRepository['record']>[0],
    principal: Principal,
    id: number,
    action: string,
    changes: object,
  ): Promise<void> {
    return this.audit.record(em, {
      userId: principal.userId,
      organisationId: principal.organisationId,
      entity: 'watering-rule',
      entityId: id,
      action,
      changes,
    });
  }
}

function requireRole(principal: Principal): void {
  if (!RULE_ROLES.has(principal.role))
    throw AppError.forbidden('Watering rules are for administrators, managers and auditors.');
}
