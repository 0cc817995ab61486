import type { DataSource } from 'typeorm';
import type { HydrozoneInput } from '@shared/hydrozones/hydrozone-dto';
import type { ApplyZoneTestInput, FieldAuditDto, ZoneTestInput } from '@shared/field-audits/field-audit-dto';
import { zoneTestResults } from '@shared/field-audits/zone-test-results';
import { slopeBand } from '@shared/field-audits/audit-schedule';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { HydrozonesService } from '../../hydrozones/domain/hydrozones-service';
import type { FieldAuditsRepository } from '../data/field-audits-repository';
import type { TestedZone, ZoneTestsRepository } from '../data/zone-tests-repository';
import type { FieldAuditAccess } from './field-audit-access';
import type { FieldAuditsService } from './field-audits-service';

/** Catch-can tests on an audit, and writing a test's results into its hydrozone once the user confirms. */
export class ZoneTestsService {
  constructor(
    private readonly db: DataSource,
    private readonly tests: ZoneTestsRepository,
    private readonly audits: FieldAuditsRepository,
    private readonly access: FieldAuditAccess,
    private readonly hydrozones: HydrozonesService,
    private readonly auditsService: FieldAuditsService,
    private readonly log: AuditRepository,
  ) {}

  async add(principal: Principal, auditId: number, input: ZoneTestInput): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, auditId, 'write');
    const zone = await this.testedZone(site.id, input);
    await this.db.transaction(async (em) => {
      const id = await this.tests.insert(em, auditId, zone, input);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, id, 'create', { auditId, hydrozone: zone.name });
    });
    return this.auditsService.get(principal, auditId);
  }

  async update(principal: Principal, auditId: number, testId: number, input: ZoneTestInput): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, auditId, 'write');
    if (!(await this.tests.find(auditId, testId))) throw AppError.notFound('Zone test');
    const zone = await this.testedZone(site.id, input);
    await this.db.transaction(async (em) => {
      await this.tests.update(em, testId, zone, input);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, testId, 'update', { auditId, hydrozone: zone.name });
    });
    return this.auditsService.get(principal, auditId);
  }

  async remove(principal: Principal, auditId: number, testId: number): Promise<void> {
    const { site } = await this.access.load(principal, auditId, 'write');
    const test = await this.tests.find(auditId, testId);
    if (!test) throw AppError.notFound('Zone test');
    await this.db.transaction(async (em) => {
      await this.tests.delete(em, testId);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, testId, 'delete', {
        auditId,
        hydrozone: test.hydrozoneName,
      });
    });
  }

  /**
   * Writes what the user ticked into the hydrozone: the audited efficiency (1 ÷ SM), the flow that gives the
   * measured rate over the zone (so run-time advice uses the measured rate), and the soil intake on its slope.
   */
  async apply(
    principal: Principal,
    auditId: number,
    testId: number,
    choice: ApplyZoneTestInput,
  ): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, auditId, 'apply');
    const test = await this.tests.find(auditId, testId);
    if (!test) throw AppError.notFound('Zone test');
    if (test.hydrozoneId === null) throw AppError.invalid('hydrozoneId', 'the tested hydrozone no longer exists');
    let results;
    try {
      results = zoneTestResults(test, test.hydrozoneAreaFt2);
    } catch (error) {
      throw AppError.invalid('catches', (error as Error).message);
    }
    const patch: Partial<HydrozoneInput> = {};
    if (choice.efficiency) patch.efficiencyOverride = round(results.auditedEfficiency, 3);
    if (choice.flow) patch.designFlowGpm = round(results.equivalentFlowGpm, 3);
    if (choice.soilIntake) {
      if (test.soilIntakeInPerHour === null) throw AppError.invalid('soilIntake', 'the test has no soil intake rate');
      const factor = test.slopePercent !== null ? slopeBand(test.slopePercent).factor : 1;
      patch.soilIntakeInPerHour = round(test.soilIntakeInPerHour * factor, 3);
    }
    if (!Object.keys(patch).length) throw AppError.invalid('efficiency', 'choose at least one result to write');
    // The hydrozone's own service checks the values, records the change and makes cached budgets stale.
    await this.hydrozones.update(principal, site.id, test.hydrozoneId, patch);
    await this.db.transaction(async (em) => {
      await this.tests.markApplied(em, testId);
      await this.record(em, principal, site.organisationId, testId, 'apply', {
        auditId,
        hydrozoneId: test.hydrozoneId,
        ...patch,
      });
    });
    return this.auditsService.get(principal, auditId);
  }

  private async testedZone(siteId: number, input: ZoneTestInput): Promise<TestedZone> {
    const zone = await this.hydrozones.load(siteId, input.hydrozoneId).catch((error: unknown) => {
      if (error instanceof AppError && error.code === 'not_found')
        throw AppError.invalid('hydrozoneId', 'is not a hydrozone of this site');
      throw error;
    });
    try {
      zoneTestResults(input, zone.areaFt2);
    } catch (error) {
      throw AppError.invalid('catches', (error as Error).message);
    }
    return { id: zone.id, name: zone.name, areaFt2: zone.areaFt2 };
  }

  private record(
    em: Parameters<AuditRepository['record']>[0],
    principal: Principal,
    organisationId: number,
    id: number,
    action: string,
    changes: unknown,
  ): Promise<void> {
    return this.log.record(em, {
      userId: principal.userId,
      organisationId,
      entity: 'field_audit_zone_test',
      entityId: id,
      action,
      changes,
    });
  }
}

function round(value: number, decimals: number): number {
  return Number(value.toFixed(decimals));
}
