import type { DataSource } from 'typeorm';
import type { EntityManager } from 'typeorm';
import type { ControllerDto, MeterDto, MeterInput, MeterSwapInput, ZoneInput } from '@shared/meters/meter';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { MetersRepository } from '../data/meters-repository';

/** A site's meters, controllers and zones: seen with `read`, changed with `contribute` (technical data). */
export class MetersService {
  constructor(
    private readonly db: DataSource,
    private readonly repo: MetersRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async meters(principal: Principal, siteId: number): Promise<MeterDto[]> {
    await this.sites.requireLevel(principal, siteId, 'read');
    return this.repo.meters(siteId);
  }

  async createMeter(principal: Principal, siteId: number, input: MeterInput): Promise<MeterDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if (await this.repo.refTaken('meter', siteId, input.ref)) throw refTaken('meter', input.ref);
    const id = await this.db.transaction(async (em) => {
      const meterId = await this.repo.insertMeter(em, siteId, input);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'meter',
        entityId: meterId,
        action: 'create',
        changes: input,
      });
      return meterId;
    });
    return (await this.repo.meters(siteId)).find((m) => m.id === id)!;
  }

  async updateMeter(
    principal: Principal,
    siteId: number,
    meterId: number,
    patch: Partial<MeterInput>,
  ): Promise<MeterDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if ((await this.repo.meterSite(meterId)) !== siteId) throw AppError.notFound('Meter');
    if (patch.ref !== undefined && (await this.repo.refTaken('meter', siteId, patch.ref, meterId)))
      throw refTaken('meter', patch.ref);
    await this.db.transaction(async (em) => {
      await this.repo.updateMeter(em, meterId, patch);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'meter',
        entityId: meterId,
        action: 'update',
        changes: patch,
      });
    });
    return (await this.repo.meters(siteId)).find((m) => m.id === meterId)!;
  }

  /** Refused while readings exist: roll back the uploads first, so no gallon disappears as a side effect. */
  async deleteMeter(principal: Principal, siteId: number, meterId: number): Promise<void> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if ((await this.repo.meterSite(meterId)) !== siteId) throw AppError.notFound('Meter');
    if (await this.repo.meterHasReadings(meterId))
      throw new AppError(
        'conflict',
        'This meter has readings; roll back the uploads that brought them before deleting it.',
      );
    await this.db.transaction(async (em) => {
      await this.repo.deleteMeter(em, meterId);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'meter',
        entityId: meterId,
        action: 'delete',
      });
    });
  }

  /** For components that already checked access (uploads): everything the sites' files can refer to. */
  async equipment(siteIds: number[]): Promise<{ meters: MeterDto[]; controllers: ControllerDto[] }> {
    return { meters: await this.repo.metersOf(siteIds), controllers: await this.repo.controllersOf(siteIds) };
  }

  /**
   * A meter swap entered on the meter form: the current register is kept as a period ending at `swappedAt`, and
   * the new register (multiplier, digits) starts then. Register reads are never differenced across the two.
   */
  async recordSwap(principal: Principal, siteId: number, meterId: number, input: MeterSwapInput): Promise<MeterDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const meter = (await this.repo.meters(siteId)).find((m) => m.id === meterId);
    if (!meter) throw AppError.notFound('Meter');
    const at = new Date(input.swappedAt);
    const after = [meter.installedAt, ...meter.previousRegisters.map((p) => p.removedAt)].filter(Boolean) as string[];
    if (after.some((iso) => Date.parse(iso) >= at.getTime()))
      throw AppError.invalid('swappedAt', "must be after the current register's installation and any earlier swap");
    if (at.getTime() > Date.now()) throw AppError.invalid('swappedAt', 'must not be in the future');
    await this.db.transaction(async (em) => {
      await this.repo.recordSwap(em, meterId, {
        at,
        multiplier: input.multiplier,
        digits: input.digits,
        oldSerial: null,
        uploadId: null,
      });
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'meter',
        entityId: meterId,
        action: 'swap',
        changes: input,
      });
    });
    return (await this.repo.meters(siteId)).find((m) => m.id === meterId)!;
  }

  /** A swap an upload recognised (the serial changed), inside the upload's transaction; undone with it. */
  recordSwapFromUpload(
    em: EntityManager,
    meterId: number,
    swap: { at: Date; multiplier: number | null; digits: number | null; oldSerial: string; uploadId: number },
  ): Promise<void> {
    return this.repo.recordSwap(em, meterId, swap);
  }

  /** Rolling an upload back: the swaps it recorded go, newest first. */
  undoUploadSwaps(em: EntityManager, uploadId: number): Promise<number> {
    return this.repo.undoUploadSwaps(em, uploadId);
  }

  async controllers(principal: Principal, siteId: number): Promise<ControllerDto[]> {
    await this.sites.requireLevel(principal, siteId, 'read');
    return this.repo.controllers(siteId);
  }

  async createController(
    principal: Principal,
    siteId: number,
    input: { ref: string; name: string; zones?: ZoneInput[] },
  ): Promise<ControllerDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if (await this.repo.refTaken('controller', siteId, input.ref)) throw refTaken('controller', input.ref);
    const stations = (input.zones ?? []).map((z) => z.station);
    if (new Set(stations).size !== stations.length) throw AppError.invalid('zones', 'two zones have the same station');
    await this.assertOwnHydrozones(
      siteId,
      (input.zones ?? []).map((z) => z.hydrozoneId),
    );
    const id = await this.db.transaction(async (em) => {
      const controllerId = await this.repo.insertController(em, siteId, input.ref, input.name);
      for (const zone of input.zones ?? []) await this.repo.insertZone(em, controllerId, zone);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'controller',
        entityId: controllerId,
        action: 'create',
        changes: input,
      });
      return controllerId;
    });
    return (await this.repo.controllers(siteId)).find((c) => c.id === id)!;
  }

  async addZone(principal: Principal, siteId: number, controllerId: number, input: ZoneInput): Promise<ControllerDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if ((await this.repo.controllerSite(controllerId)) !== siteId) throw AppError.notFound('Controller');
    if (await this.repo.stationTaken(controllerId, input.station)) throw stationTaken(input.station);
    await this.assertOwnHydrozones(siteId, [input.hydrozoneId]);
    await this.db.transaction(async (em) => {
      const zoneId = await this.repo.insertZone(em, controllerId, input);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'zone',
        entityId: zoneId,
        action: 'create',
        changes: input,
      });
    });
    return (await this.repo.controllers(siteId)).find((c) => c.id === controllerId)!;
  }

  /** A zone links only to a hydrozone of its own site; any other id (another site's, or none) is refused alike. */
  private async assertOwnHydrozones(siteId: number, ids: (number | null | undefined)[]): Promise<void> {
    const wanted = [...new Set(ids.filter((id): id is number => typeof id === 'number'))];
    const own = await this.repo.hydrozonesOfSite(siteId, wanted);
    if (wanted.some((id) => !own.has(id))) throw AppError.invalid('hydrozoneId', 'is not a hydrozone of this site');
  }

  /** Renames, renumbers or relinks one zone (e.g. to the hydrozone it waters); answers with its controller. */
  async updateZone(
    principal: Principal,
    siteId: number,
    controllerId: number,
    zoneId: number,
    patch: Partial<ZoneInput>,
  ): Promise<ControllerDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if ((await this.repo.controllerSite(controllerId)) !== siteId) throw AppError.notFound('Controller');
    if ((await this.repo.zoneController(zoneId)) !== controllerId) throw AppError.notFound('Zone');
    if (patch.station !== undefined && (await this.repo.stationTaken(controllerId, patch.station, zoneId)))
      throw stationTaken(patch.station);
    await this.assertOwnHydrozones(siteId, [patch.hydrozoneId]);
    await this.db.transaction(async (em) => {
      await this.repo.updateZone(em, zoneId, patch);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'zone',
        entityId: zoneId,
        action: 'update',
        changes: patch,
      });
    });
    return (await this.repo.controllers(siteId)).find((c) => c.id === controllerId)!;
  }
}

function stationTaken(station: string): AppError {
  return new AppError('conflict', `Station "${station}" already exists on this controller.`, [
    { field: 'station', message: 'is already used' },
  ]);
}

function refTaken(what: string, ref: string): AppError {
  return new AppError('conflict', `A ${what} "${ref}" already exists on this site.`, [
    { field: 'ref', message: 'is already used on this site' },
  ]);
}
