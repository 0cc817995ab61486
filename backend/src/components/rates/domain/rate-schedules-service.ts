import type { DataSource } from 'typeorm';
import { validateRateSchedule } from '@shared/rates/rate-schedule';
import type { RateScheduleDto, RateScheduleInput } from '@shared/rates/rate-schedule-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { RateSchedulesRepository } from '../data/rate-schedules-repository';

/** A site's rate schedules: technical data (`contribute` changes them); each applies until the next one starts. */
export class RateSchedulesService {
  constructor(
    private readonly db: DataSource,
    private readonly rates: RateSchedulesRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async list(principal: Principal, siteId: number): Promise<RateScheduleDto[]> {
    await this.sites.requireLevel(principal, siteId, 'read');
    return this.rates.all(siteId);
  }

  /** For the budget; the caller has checked access. */
  allOfSite(siteId: number): Promise<RateScheduleDto[]> {
    return this.rates.all(siteId);
  }

  /** For the portfolio's money figures, one query for many sites; the caller has checked access. */
  allOfSites(siteIds: number[]): Promise<Map<number, RateScheduleDto[]>> {
    return this.rates.allOfSites(siteIds);
  }

  async create(principal: Principal, siteId: number, input: RateScheduleInput): Promise<RateScheduleDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    check(input);
    await this.assertStartFree(siteId, input.effectiveFrom);
    const id = await this.db.transaction(async (em) => {
      const rid = await this.rates.insert(em, siteId, input);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'rate_schedule',
        entityId: rid,
        action: 'create',
        changes: { siteId, ...input },
      });
      return rid;
    });
    return (await this.rates.find(siteId, id))!;
  }

  async update(
    principal: Principal,
    siteId: number,
    id: number,
    patch: Partial<RateScheduleInput>,
  ): Promise<RateScheduleDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const before = await this.load(siteId, id);
    const merged: RateScheduleInput = { ...before, ...patch };
    check(merged);
    if (merged.effectiveFrom !== before.effectiveFrom) await this.assertStartFree(siteId, merged.effectiveFrom, id);
    const changes = diff(before as RateScheduleInput, patch);
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.rates.update(em, id, merged);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: site.organisationId,
          entity: 'rate_schedule',
          entityId: id,
          action: 'update',
          changes,
        });
      });
    }
    return (await this.rates.find(siteId, id))!;
  }

  async remove(principal: Principal, siteId: number, id: number): Promise<void> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const before = await this.load(siteId, id);
    await this.db.transaction(async (em) => {
      await this.rates.delete(em, id);
      // Nothing newer is left to compare with: drop the site's cached monthly budgets outright.
      await em.query('DELETE FROM site_monthly_budget WHERE site_id = ?', [siteId]);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'rate_schedule',
        entityId: id,
        action: 'delete',
        changes: { siteId, name: before.name },
      });
    });
  }

  private async load(siteId: number, id: number): Promise<RateScheduleDto> {
    const found = await this.rates.find(siteId, id);
    if (!found) throw AppError.notFound('Rate schedule');
    return found;
  }

  private async assertStartFree(siteId: number, effectiveFrom: string, exceptId?: number): Promise<void> {
    if (await this.rates.startTaken(siteId, effectiveFrom, exceptId)) {
      throw new AppError('conflict', `Another rate schedule of this site already starts on ${effectiveFrom}.`, [
        { field: 'effectiveFrom', message: 'another schedule starts on this date' },
      ]);
    }
  }
}

function check(input: RateScheduleInput): void {
  const problems = validateRateSchedule(input);
  if (problems.length) {
    throw new AppError(
      'validation_failed',
      `Rate schedule is invalid — ${problems.join('; ')}`,
      problems.map((message) => ({ field: 'volumeCharge', message })),
    );
  }
}

/** The schedule in force on `date`: the latest one starting on or before it. */
export function scheduleInForce(schedules: readonly RateScheduleDto[], date: string): RateScheduleDto | null {
  let found: RateScheduleDto | null = null;
  for (const s of schedules)
    if (s.effectiveFrom <= date && (!found || s.effectiveFrom > found.effectiveFrom)) found = s;
  return found;
}
