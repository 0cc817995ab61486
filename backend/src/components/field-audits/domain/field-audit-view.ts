import { auditSchedule, type AuditSchedule } from '@shared/field-audits/audit-schedule';
import {
  FIELD_AUDIT_CAUTIONS,
  type FaultDto,
  type FieldAuditDto,
  type FieldAuditSummaryDto,
  type ZoneTestDto,
  type ZoneTestResults,
} from '@shared/field-audits/field-audit-dto';
import { zoneTestResults } from '@shared/field-audits/zone-test-results';
import type { BudgetZoneMonthDto } from '@shared/budgets/budget-dto';
import { GALLONS_PER_INCH_SQUARE_FOOT } from '@shared/units/area-depth-units';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { BudgetsService } from '../../budgets/domain/budgets-service';
import type { FieldAuditRecord } from '../data/field-audits-repository';
import type { FaultRecord, FaultsRepository, PhotoRecord } from '../data/faults-repository';
import type { ZoneTestRecord, ZoneTestsRepository } from '../data/zone-tests-repository';
import type { AuditAccess } from './field-audit-access';

export const FIELD_AUDIT_METHOD = [
  'Catches in mL are turned into depths by the can opening (1 in³ = 16.387064 mL); the measured precipitation ' +
    'rate is the mean depth ÷ run minutes × 60.',
  'DU_lq = mean of the lowest quarter of catches ÷ mean of all catches (Keller & Bliesner, Sprinkler and ' +
    'Trickle Irrigation); the lowest quarter is n ÷ 4 cans, rounded.',
  'Scheduling multiplier SM = 1 ÷ (0.4 + 0.6 × DU_lq) (Irrigation Association auditor practice, from memory); ' +
    'the audited efficiency written to a hydrozone is 1 ÷ SM.',
  "Run times: the plants' weekly need (ETo × plant factor for the schedule month) ÷ measured rate × 60 × SM, " +
    "capped by what the zone's water budget allows (budget depth ÷ measured rate × 60).",
  'Cycle-and-soak: one cycle applies no more than the soil takes in an hour (60 × intake ÷ rate), with the ' +
    'intake reduced on slopes (factors from memory). Common practice, no source.',
];

/** Puts an audit together for the page and the PDF: its tests with results and run times, its faults and photos. */
export class FieldAuditView {
  constructor(
    private readonly tests: ZoneTestsRepository,
    private readonly faults: FaultsRepository,
    private readonly budgets: BudgetsService,
  ) {}

  summary(audit: FieldAuditRecord, siteName: string, canEdit: boolean, tests: ZoneTestRecord[]): FieldAuditSummaryDto {
    const dus = tests.map((t) => safeResults(t)?.du).filter((d): d is number => d !== undefined);
    return {
      id: audit.id,
      siteId: audit.siteId,
      siteName,
      title: audit.title,
      auditedOn: audit.auditedOn,
      status: audit.status,
      organisationName: audit.organisationName,
      zoneTestCount: audit.zoneTestCount,
      openFaultCount: audit.openFaultCount,
      meanDu: dus.length ? dus.reduce((s, d) => s + d, 0) / dus.length : null,
      canEdit,
      updatedAt: audit.updatedAt.toISOString(),
    };
  }

  async full(principal: Principal, access: AuditAccess): Promise<FieldAuditDto> {
    const { audit, site } = access;
    const tests = await this.tests.ofAudits([audit.id]);
    const faults = await this.faults.ofAudits([audit.id]);
    const photos = await this.faults.photosOf(faults.map((f) => f.id));
    const zoneBudgets = await this.monthBudget(principal, audit);
    return {
      ...this.summary(audit, site.name, access.canEdit, tests),
      scheduleMonth: audit.scheduleMonth,
      daysPerWeek: audit.daysPerWeek,
      staticPressurePsi: audit.staticPressurePsi,
      notes: audit.notes,
      createdByName: audit.createdByName,
      canApply: access.canApply,
      zoneTests: tests.map((t) => testDto(t, audit.daysPerWeek, zoneBudgets)),
      faults: faults.map((f) => faultDto(f, photos)),
      cautions: FIELD_AUDIT_CAUTIONS,
      method: FIELD_AUDIT_METHOD,
    };
  }

  /** The site's budget for the schedule month, per hydrozone; or why there is none. */
  private async monthBudget(
    principal: Principal,
    audit: FieldAuditRecord,
  ): Promise<{ zones: BudgetZoneMonthDto[]; days: number } | string> {
    try {
      const budget = await this.budgets.budget(
        principal,
        audit.siteId,
        audit.scheduleMonth,
        audit.scheduleMonth,
        'none',
      );
      const month = budget.months[0]!;
      return { zones: month.zones, days: month.days };
    } catch (error) {
      if (error instanceof AppError && error.code === 'validation_failed') return error.message;
      throw error;
    }
  }
}

function safeResults(t: ZoneTestRecord): ZoneTestResults | null {
  try {
    return zoneTestResults(t, t.hydrozoneAreaFt2);
  } catch {
    return null;
  }
}

function testDto(
  t: ZoneTestRecord,
  daysPerWeek: number,
  budget: { zones: BudgetZoneMonthDto[]; days: number } | string,
): ZoneTestDto {
  let results: ZoneTestResults | null = null;
  let schedule: AuditSchedule | null = null;
  let problem: string | null = null;
  try {
    results = zoneTestResults(t, t.hydrozoneAreaFt2);
  } catch (error) {
    problem = (error as Error).message;
  }
  if (results) {
    const zone = typeof budget === 'string' ? undefined : budget.zones.find((z) => z.zoneId === t.hydrozoneId);
    if (typeof budget === 'string') problem = `No run times: ${budget}`;
    else if (!zone) problem = 'No run times: the hydrozone is no longer on the site.';
    else schedule = scheduleFor(t, results, zone, budget.days, daysPerWeek);
  }
  return {
    id: t.id,
    auditId: t.auditId,
    hydrozoneId: t.hydrozoneId,
    hydrozoneName: t.hydrozoneName,
    hydrozoneAreaFt2: t.hydrozoneAreaFt2,
    headType: t.headType,
    runMinutes: t.runMinutes,
    catchUnit: t.catchUnit,
    throatDiameter: t.throatDiameter,
    throatUnit: t.throatUnit,
    catches: t.catches,
    pressures: t.pressures,
    soilIntakeInPerHour: t.soilIntakeInPerHour,
    slopePercent: t.slopePercent,
    notes: t.notes,
    results,
    schedule,
    problem,
    appliedAt: t.appliedAt?.toISOString() ?? null,
  };
}

function scheduleFor(
  t: ZoneTestRecord,
  results: ZoneTestResults,
  zone: BudgetZoneMonthDto,
  days: number,
  daysPerWeek: number,
): AuditSchedule {
  const perWeek = 7 / days;
  return auditSchedule({
    netWeeklyDepthIn: (zone.etoMm / 25.4) * zone.plantFactor * perWeek,
    budgetWeeklyDepthIn: (zone.gallons / (zone.areaFt2 * GALLONS_PER_INCH_SQUARE_FOOT)) * perWeek,
    prInPerHour: results.prInPerHour,
    du: results.du,
    daysPerWeek,
    soilIntakeInPerHour: t.soilIntakeInPerHour,
    slopePercent: t.slopePercent,
  });
}

function faultDto(f: FaultRecord, photos: PhotoRecord[]): FaultDto {
  return {
    id: f.id,
    auditId: f.auditId,
    zoneTestId: f.zoneTestId,
    kind: f.kind,
    location: f.location,
    description: f.description,
    status: f.status,
    photos: photos
      .filter((p) => p.faultId === f.id)
      .map((p) => ({
        id: p.id,
        faultId: p.faultId,
        contentType: p.contentType,
        sizeBytes: p.sizeBytes,
        url: `/api/field-audit-photos/${p.id}`,
        createdAt: p.createdAt.toISOString(),
      })),
  };
}
