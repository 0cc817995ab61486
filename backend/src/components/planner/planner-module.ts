import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { EtafService } from '../etaf/domain/etaf-service';
import type { HydrozonesService } from '../hydrozones/domain/hydrozones-service';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SavingsProjectsService } from '../savings/domain/savings-projects-service';
import type { SitesService } from '../sites/domain/sites-service';
import { plansRouter, sitePlansRouter } from './api/planner-router';
import { PlansRepository } from './data/plans-repository';
import { PlanCarryOut } from './domain/plan-carry-out';
import { PlanComparisonService } from './domain/plan-comparison-service';
import { PlanZones } from './domain/plan-zones-source';
import { PlansService } from './domain/plans-service';

export interface PlannerDeps {
  db: DataSource;
  sites: SitesService;
  hydrozones: HydrozonesService;
  budgets: BudgetsService;
  rates: RateSchedulesService;
  etaf: EtafService;
  savings: SavingsProjectsService;
  audit: AuditRepository;
}

/** The what-if planner: one router mounted on /api. */
export function createPlanner(d: PlannerDeps): { router: Router } {
  const repo = new PlansRepository(d.db);
  const zones = new PlanZones(d.hydrozones);
  const plans = new PlansService(d.db, repo, d.sites, zones, d.audit);
  const comparison = new PlanComparisonService(plans, zones, d.budgets, d.rates, d.etaf);
  const carryOut = new PlanCarryOut(d.db, plans, repo, comparison, d.savings, d.audit);
  const router = Router();
  router.use('/sites/:id/plans', sitePlansRouter(plans));
  router.use('/plans', plansRouter(plans, comparison, carryOut));
  return { router };
}
