import type { DataSource } from 'typeorm';
import type { CarryOutInput, PlanDto } from '@shared/planner/plan-dto';
import { savingsProjectFor } from '@shared/planner/carry-out';
import type { SavingsProjectDto } from '@shared/savings/savings-project-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SavingsProjectsService } from '../../savings/domain/savings-projects-service';
import type { PlansRepository } from '../data/plans-repository';
import type { PlanComparisonService } from './plan-comparison-service';
import type { PlansService } from './plans-service';

/**
 * A carried-out plan becomes a savings project whose baseline and reporting months are already chosen, made
 * through the savings component's own service (its checks and audit entry), then the plan is marked with it.
 */
export class PlanCarryOut {
  constructor(
    private readonly db: DataSource,
    private readonly plans: PlansService,
    private readonly repo: PlansRepository,
    private readonly comparison: PlanComparisonService,
    private readonly savings: SavingsProjectsService,
    private readonly audit: AuditRepository,
  ) {}

  async carryOut(
    principal: Principal,
    planId: number,
    input: CarryOutInput,
  ): Promise<{ plan: PlanDto; project: SavingsProjectDto }> {
    const { plan, site } = await this.plans.load(principal, planId, 'contribute');
    if (plan.status === 'carried-out')
      throw new AppError('conflict', `This plan was carried out on ${plan.carriedOutOn}.`);
    const compared = await this.comparison.compare(principal, planId).catch(() => null);
    const changeSummary = compared
      ? compared.zones.filter((z) => z.changes.length).map((z) => `${z.name}: ${z.changes.join(', ')}`)
      : [];
    const project = await this.savings.create(principal, site.id, savingsProjectFor({ ...plan, changeSummary }, input));
    await this.db.transaction(async (em) => {
      await this.repo.markCarriedOut(em, planId, project.id, input.installedOn);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'what_if_plan',
        entityId: planId,
        action: 'carry-out',
        changes: { savingsProjectId: project.id, installedOn: input.installedOn },
      });
    });
    return { plan: await this.plans.get(principal, planId), project };
  }
}
