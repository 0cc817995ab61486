import { In, type DataSource, type EntityManager } from 'typeorm';
import type { CatchUnit, ThroatUnit } from '@shared/field-audits/catch-can';
import type { AuditedHeadType, PressureReading, ZoneTestInput } from '@shared/field-audits/field-audit-dto';
import { FieldAuditZoneTestEntity } from './field-audit-zone-test.entity';

export interface ZoneTestRecord extends Required<Omit<ZoneTestInput, 'hydrozoneId'>> {
  id: number;
  auditId: number;
  hydrozoneId: number | null;
  hydrozoneName: string;
  hydrozoneAreaFt2: number;
  appliedAt: Date | null;
}

/** The hydrozone as it was when tested. */
export interface TestedZone {
  id: number;
  name: string;
  areaFt2: number;
}

/** Catch-can tests of audits; callers check access to the audit first. */
export class ZoneTestsRepository {
  constructor(private readonly db: DataSource) {}

  async ofAudits(auditIds: number[]): Promise<ZoneTestRecord[]> {
    if (!auditIds.length) return [];
    const rows = await this.db
      .getRepository(FieldAuditZoneTestEntity)
      .find({ where: { auditId: In(auditIds) }, order: { id: 'ASC' } });
    return rows.map(toRecord);
  }

  async find(auditId: number, id: number): Promise<ZoneTestRecord | null> {
    const row = await this.db.getRepository(FieldAuditZoneTestEntity).findOneBy({ auditId, id });
    return row ? toRecord(row) : null;
  }

  async insert(em: EntityManager, auditId: number, zone: TestedZone, input: ZoneTestInput): Promise<number> {
    const result = await em.getRepository(FieldAuditZoneTestEntity).insert({
      auditId,
      hydrozoneId: zone.id,
      hydrozoneName: zone.name,
      hydrozoneAreaFt2: zone.areaFt2,
      ...columns(input),
    });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, zone: TestedZone, input: ZoneTestInput): Promise<void> {
    await em.getRepository(FieldAuditZoneTestEntity).update(
      { id },
      {
        hydrozoneId: zone.id,
        hydrozoneName: zone.name,
        hydrozoneAreaFt2: zone.areaFt2,
        ...columns(input),
        appliedAt: null,
      },
    );
  }

  async markApplied(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(FieldAuditZoneTestEntity).update({ id }, { appliedAt: new Date() });
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(FieldAuditZoneTestEntity).delete({ id });
  }
}

function columns(input: ZoneTestInput) {
  return {
    headType: input.headType,
    runMinutes: input.runMinutes,
    catchUnit: input.catchUnit,
    throatDiameter: input.throatDiameter ?? null,
    throatUnit: input.throatDiameter != null ? (input.throatUnit ?? 'in') : null,
    catches: JSON.stringify(input.catches),
    pressures: JSON.stringify(input.pressures ?? []),
    soilIntakeInPerHour: input.soilIntakeInPerHour ?? null,
    slopePercent: input.slopePercent ?? null,
    notes: input.notes ?? '',
  };
}

function toRecord(r: FieldAuditZoneTestEntity): ZoneTestRecord {
  return {
    id: r.id,
    auditId: r.auditId,
    hydrozoneId: r.hydrozoneId,
    hydrozoneName: r.hydrozoneName,
    hydrozoneAreaFt2: r.hydrozoneAreaFt2,
    headType: r.headType as AuditedHeadType,
    runMinutes: r.runMinutes,
    catchUnit: r.catchUnit as CatchUnit,
    throatDiameter: r.throatDiameter,
    throatUnit: r.throatUnit as ThroatUnit | null,
    catches: JSON.parse(r.catches) as number[],
    pressures: JSON.parse(r.pressures) as PressureReading[],
    soilIntakeInPerHour: r.soilIntakeInPerHour,
    slopePercent: r.slopePercent,
    notes: r.notes,
    appliedAt: r.appliedAt,
  };
}
