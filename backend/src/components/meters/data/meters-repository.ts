import type { DataSource, EntityManager } from 'typeorm';
import type { ControllerDto, MeterDto, MeterInput, ZoneDto, ZoneInput } from '@shared/meters/meter';
import { ControllerEntity } from './controller.entity';
import { MeterRegisterPeriodEntity } from './meter-register-period.entity';
import { MeterEntity } from './meter.entity';
import { ZoneEntity } from './zone.entity';

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const date = (s: string | null) => (s ? new Date(s) : null);

/** Meters, their earlier registers, controllers and zones of one site; returns plain DTOs. */
export class MetersRepository {
  constructor(private readonly db: DataSource) {}

  async meters(siteId: number): Promise<MeterDto[]> {
    return this.metersOf([siteId]);
  }

  /** The meters of several sites (a file for a whole organisation). */
  async metersOf(siteIds: number[]): Promise<MeterDto[]> {
    if (siteIds.length === 0) return [];
    const rows = await this.db
      .getRepository(MeterEntity)
      .createQueryBuilder('m')
      .where('m.site_id IN (:...siteIds)', { siteIds })
      .orderBy('m.ref', 'ASC')
      .getMany();
    if (rows.length === 0) return [];
    const periods = await this.db
      .getRepository(MeterRegisterPeriodEntity)
      .createQueryBuilder('p')
      .where('p.meter_id IN (:...ids)', { ids: rows.map((r) => r.id) })
      .orderBy('p.installed_at', 'ASC')
      .getMany();
    return rows.map((m) => ({
      id: m.id,
      siteId: m.siteId,
      ref: m.ref,
      unit: m.unit,
      registerMultiplier: m.registerMultiplier,
      registerDigits: m.registerDigits,
      purpose: m.purpose,
      waterSource: m.waterSource,
      installedAt: iso(m.installedAt),
      removedAt: iso(m.removedAt),
      previousRegisters: periods
        .filter((p) => p.meterId === m.id)
        .map((p) => ({
          installedAt: p.installedAt.toISOString(),
          removedAt: p.removedAt.toISOString(),
          multiplier: p.multiplier,
          digits: p.digits,
          serial: p.serial,
          uploadId: p.uploadId,
        })),
    }));
  }

  async meterSite(meterId: number): Promise<number | null> {
    return (await this.db.getRepository(MeterEntity).findOneBy({ id: meterId }))?.siteId ?? null;
  }

  async refTaken(table: 'meter' | 'controller', siteId: number, ref: string, exceptId?: number): Promise<boolean> {
    const repo = table === 'meter' ? this.db.getRepository(MeterEntity) : this.db.getRepository(ControllerEntity);
    const found = await repo.findOneBy({ siteId, ref });
    return !!found && found.id !== exceptId;
  }

  async insertMeter(em: EntityManager, siteId: number, input: MeterInput): Promise<number> {
    const { previousRegisters, installedAt, removedAt, ...fields } = input;
    const id = Number(
      (
        await em
          .getRepository(MeterEntity)
          .insert({ ...fields, siteId, installedAt: date(installedAt), removedAt: date(removedAt) })
      ).identifiers[0]!['id'],
    );
    await this.replacePeriods(em, id, previousRegisters);
    return id;
  }

  async updateMeter(em: EntityManager, meterId: number, patch: Partial<MeterInput>): Promise<void> {
    const { previousRegisters, installedAt, removedAt, ...fields } = patch;
    const update: Partial<MeterEntity> = { ...fields };
    if (installedAt !== undefined) update.installedAt = date(installedAt);
    if (removedAt !== undefined) update.removedAt = date(removedAt);
    if (Object.keys(update).length) await em.getRepository(MeterEntity).update({ id: meterId }, update);
    if (previousRegisters) await this.replacePeriods(em, meterId, previousRegisters);
  }

  async meterHasReadings(meterId: number): Promise<boolean> {
    const [row] = await this.db.query(
      `SELECT EXISTS(SELECT 1 FROM meter_reading WHERE meter_id = ?) AS r1, EXISTS(SELECT 1 FROM
        meter_register_read WHERE meter_id = ?) AS r2`,
      [meterId, meterId],
    );
    return Number(row.r1) === 1 || Number(row.r2) === 1;
  }

  async deleteMeter(em: EntityManager, meterId: number): Promise<void> {
    await em.getRepository(MeterEntity).delete({ id: meterId });
  }

  private async replacePeriods(
    em: EntityManager,
    meterId: number,
    periods: MeterInput['previousRegisters'],
  ): Promise<void> {
    await em.getRepository(MeterRegisterPeriodEntity).delete({ meterId });
    if (periods.length) {
      await em.getRepository(MeterRegisterPeriodEntity).insert(
        periods.map((p) => ({
          meterId,
          installedAt: new Date(p.installedAt),
          removedAt: new Date(p.removedAt),
          multiplier: p.multiplier,
          digits: p.digits,
        })),
      );
    }
  }

  /**
   * Records a swap: the current register becomes a period ending at `at` and the meter's current register starts
   * there with the new multiplier and digits. `uploadId` when an upload saw it (undone with that upload).
   */
  async recordSwap(
    em: EntityManager,
    meterId: number,
    swap: {
      at: Date;
      multiplier: number | null;
      digits: number | null;
      oldSerial: string | null;
      uploadId: number | null;
    },
  ): Promise<void> {
    const meter = await em.getRepository(MeterEntity).findOneByOrFail({ id: meterId });
    await em.getRepository(MeterRegisterPeriodEntity).insert({
      meterId,
      installedAt: meter.installedAt ?? new Date(0),
      removedAt: swap.at,
      multiplier: meter.registerMultiplier,
      digits: meter.registerDigits,
      serial: swap.oldSerial,
      uploadId: swap.uploadId,
    });
    await em.getRepository(MeterEntity).update(
      { id: meterId },
      {
        installedAt: swap.at,
        registerMultiplier: swap.multiplier ?? meter.registerMultiplier,
        registerDigits: swap.digits === null ? meter.registerDigits : swap.digits,
      },
    );
  }

  /** Undoes the swaps an upload recorded, newest first: each meter gets its earlier register back. */
  async undoUploadSwaps(em: EntityManager, uploadId: number): Promise<number> {
    const periods = await em
      .getRepository(MeterRegisterPeriodEntity)
      .find({ where: { uploadId }, order: { installedAt: 'DESC' } });
    for (const p of periods) {
      await em.getRepository(MeterEntity).update(
        { id: p.meterId },
        {
          installedAt: p.installedAt.getTime() === 0 ? null : p.installedAt,
          registerMultiplier: p.multiplier,
          registerDigits: p.digits,
        },
      );
      await em.getRepository(MeterRegisterPeriodEntity).delete({ id: p.id });
    }
    return periods.length;
  }

  async controllers(siteId: number): Promise<ControllerDto[]> {
    return this.controllersOf([siteId]);
  }

  async controllersOf(siteIds: number[]): Promise<ControllerDto[]> {
    if (siteIds.length === 0) return [];
    const controllers = await this.db
      .getRepository(ControllerEntity)
      .createQueryBuilder('c')
      .where('c.site_id IN (:...siteIds)', { siteIds })
      .orderBy('c.ref', 'ASC')
      .getMany();
    if (controllers.length === 0) return [];
    const zones = await this.db
      .getRepository(ZoneEntity)
      .createQueryBuilder('z')
      .where('z.controller_id IN (:...ids)', { ids: controllers.map((c) => c.id) })
      .orderBy('z.station', 'ASC')
      .getMany();
    return controllers.map((c) => ({
      id: c.id,
      siteId: c.siteId,
      ref: c.ref,
      name: c.name,
      zones: zones.filter((z) => z.controllerId === c.id).map(toZoneDto),
    }));
  }

  async controllerSite(controllerId: number): Promise<number | null> {
    return (await this.db.getRepository(ControllerEntity).findOneBy({ id: controllerId }))?.siteId ?? null;
  }

  /** Which of these hydrozone ids belong to the site (a zone may only link to its own site's hydrozones). */
  async hydrozonesOfSite(siteId: number, hydrozoneIds: number[]): Promise<Set<number>> {
    if (!hydrozoneIds.length) return new Set();
    const rows: { id: number }[] = await this.db.query('SELECT id FROM hydrozone WHERE site_id = ? AND id IN (?)', [
      siteId,
      hydrozoneIds,
    ]);
    return new Set(rows.map((r) => Number(r.id)));
  }

  async insertController(em: EntityManager, siteId: number, ref: string, name: string): Promise<number> {
    return Number((await em.getRepository(ControllerEntity).insert({ siteId, ref, name })).identifiers[0]!['id']);
  }

  async stationTaken(controllerId: number, station: string, exceptZoneId?: number): Promise<boolean> {
    const zone = await this.db.getRepository(ZoneEntity).findOneBy({ controllerId, station });
    return !!zone && zone.id !== exceptZoneId;
  }

  async zoneController(zoneId: number): Promise<number | null> {
    return (await this.db.getRepository(ZoneEntity).findOneBy({ id: zoneId }))?.controllerId ?? null;
  }

  async updateZone(em: EntityManager, zoneId: number, patch: Partial<ZoneInput>): Promise<void> {
    if (Object.keys(patch).length) await em.getRepository(ZoneEntity).update({ id: zoneId }, patch);
  }

  async insertZone(em: EntityManager, controllerId: number, input: ZoneInput): Promise<number> {
    return Number((await em.getRepository(ZoneEntity).insert({ ...input, controllerId })).identifiers[0]!['id']);
  }
}

function toZoneDto(z: ZoneEntity): ZoneDto {
  return {
    id: z.id,
    controllerId: z.controllerId,
    station: z.station,
    name: z.name,
    hydrozoneId: z.hydrozoneId,
    designGpm: z.designGpm,
    emitterCount: z.emitterCount,
    emitterGph: z.emitterGph,
  };
}
