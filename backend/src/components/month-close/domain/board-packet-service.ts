import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Page } from '@shared/api/page';
import type { BoardPacketDto, BoardPacketInput } from '@shared/month-close/month-close-dto';
import { lastDayOfMonth } from '@shared/portfolio/period';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { logger } from '../../../platform/logger';
import { reportFormat } from '../../../platform/report-format';
import type { FileStore } from '../../../platform/storage/file-store';
import type { AlertsService } from '../../alerts/domain/alerts-service';
import type { OrganisationSettingsService } from '../../organisations/domain/organisation-settings-service';
import type { ReadingsService } from '../../readings/domain/readings-service';
import type { BoardPacketsRepository } from '../data/board-packets-repository';
import { boardPacketPdf, type PacketSite } from './board-packet-pdf';
import type { MonthCloseService } from './month-close-service';

/**
 * Board packets: a manager picks the month and the sites; the packet is built in the background (progress per site
 * is stored, so any instance can report it), the PDF goes to file storage and is downloaded from there. Packets run
 * one at a time per instance, so a burst of requests cannot starve the API of CPU.
 */
export class BoardPacketService {
  private queue: Promise<void> = Promise.resolve();

  constructor(
    private readonly packets: BoardPacketsRepository,
    private readonly monthClose: MonthCloseService,
    private readonly readings: ReadingsService,
    private readonly alerts: AlertsService,
    private readonly settings: OrganisationSettingsService,
    private readonly files: FileStore,
  ) {}

  async start(principal: Principal, input: BoardPacketInput): Promise<BoardPacketDto> {
    this.monthClose.requireClosingRole(principal);
    const owned = new Set((await this.monthClose.ownedSites(principal)).map((s) => s.id));
    const unknown = input.siteIds.filter((id) => !owned.has(id));
    if (unknown.length) throw AppError.invalid('siteIds', `not sites of your organisation: ${unknown.join(', ')}`);
    const id = await this.packets.insert({
      organisationId: principal.organisationId,
      month: input.month,
      title: input.title,
      siteIds: [...new Set(input.siteIds)],
      createdBy: principal.userId,
    });
    // Queued behind any packet already building here; a failure is stored on the packet, never thrown.
    this.queue = this.queue.then(() => this.build(principal, id));
    return this.get(principal, id);
  }

  async get(principal: Principal, id: number): Promise<BoardPacketDto> {
    this.monthClose.requireClosingRole(principal);
    const packet = await this.packets.find(principal.organisationId, id);
    if (!packet) throw AppError.notFound('Board packet');
    const { storageKey: _key, ...dto } = packet;
    return dto;
  }

  async list(
    principal: Principal,
    q: { month?: string; page: number; pageSize: number },
  ): Promise<Page<BoardPacketDto>> {
    this.monthClose.requireClosingRole(principal);
    const { items, total } = await this.packets.list(principal.organisationId, q);
    return { items, total, page: q.page, pageSize: q.pageSize };
  }

  /** The finished PDF as a stream from storage; 409 while it is still being built. */
  async file(principal: Principal, id: number): Promise<{ stream: Readable; fileName: string; sizeBytes: number }> {
    this.monthClose.requireClosingRole(principal);
    const packet = await this.packets.find(principal.organisationId, id);
    if (!packet) throw AppError.notFound('Board packet');
    if (packet.status !== 'done' || !packet.storageKey)
      throw new AppError('conflict', `This packet is ${packet.status}; it can be downloaded once it is done.`);
    const safe = packet.title.replace(/[^A-Za-z0-9-]+/g, '-').replace(/^-|-$/g, '') || 'board-packet';
    return {
      stream: this.files.open(packet.storageKey),
      fileName: `${safe.slice(0, 60)}-${packet.month}.pdf`,
      sizeBytes: packet.sizeBytes ?? 0,
    };
  }

  /** Builds one packet: each site's figures (progress after each), then the PDF, then storage. */
  private async build(principal: Principal, id: number): Promise<void> {
    try {
      const packet = (await this.packets.find(principal.organisationId, id))!;
      const sites = await this.monthClose.ownedSites(principal);
      const chosen = packet.siteIds.map((sid) => sites.find((s) => s.id === sid)).filter((s) => s !== undefined);
      const rows = await this.monthClose.rows(principal, chosen, packet.month);
      const pages: PacketSite[] = [];
      await this.packets.progress(id, 0);
      for (const row of rows) {
        pages.push(await this.sitePage(principal, row, packet.month));
        await this.packets.progress(id, pages.length);
      }
      const { unitSystem } = await this.settings.get(principal);
      const pdf = await boardPacketPdf({
        title: packet.title,
        organisationName:
          principal.memberships.find((m) => m.organisationId === principal.organisationId)?.organisationName ?? '',
        month: packet.month,
        preparedBy: principal.displayName,
        preparedOn: new Date().toISOString(),
        format: reportFormat(unitSystem),
        sites: pages,
      });
      await this.packets.finish(id, { storageKey: await this.store(pdf), sizeBytes: pdf.length });
    } catch (error) {
      logger.error('board packet failed', { packetId: id, error: String(error) });
      const message = error instanceof AppError ? error.message : 'The packet could not be built.';
      await this.packets.fail(id, message).catch(() => undefined);
    }
  }

  private async sitePage(principal: Principal, row: PacketSite['row'], month: string): Promise<PacketSite> {
    const overview = await this.readings.overview(principal, row.siteId, `${month}-01`, lastDayOfMonth(month));
    return {
      row,
      days: overview.days.map((d) => ({ date: d.date, useGallons: d.useGallons, budgetGallons: d.budgetGallons })),
      alerts: await this.alerts.monthAlerts(row.siteId, month),
    };
  }

  private async store(pdf: Buffer): Promise<string> {
    const pending = this.files.begin();
    try {
      await pending.write(pdf);
      return await pending.keep(createHash('sha256').update(pdf).digest('hex'));
    } catch (error) {
      await pending.discard();
      throw error;
    }
  }
}
