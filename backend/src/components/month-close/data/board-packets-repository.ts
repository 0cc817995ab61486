import type { DataSource } from 'typeorm';
import type { BoardPacketDto } from '@shared/month-close/month-close-dto';
import { BoardPacketEntity } from './board-packet.entity';

/** A packet still queued or running after this long was cut off (its instance stopped): it shows as failed. */
const STALLED_MS = 15 * 60_000;

interface PacketRow extends BoardPacketEntity {
  createdByName: string | null;
}

/** Board packet jobs: what was asked, how far it got, where the PDF is kept. */
export class BoardPacketsRepository {
  constructor(private readonly db: DataSource) {}

  async insert(packet: {
    organisationId: number;
    month: string;
    title: string;
    siteIds: number[];
    createdBy: number;
  }): Promise<number> {
    const result = await this.db.getRepository(BoardPacketEntity).insert({
      organisationId: packet.organisationId,
      month: packet.month,
      title: packet.title,
      siteIds: JSON.stringify(packet.siteIds),
      totalSites: packet.siteIds.length,
      createdBy: packet.createdBy,
    });
    return Number(result.identifiers[0]!['id']);
  }

  async progress(id: number, doneSites: number): Promise<void> {
    await this.db.query("UPDATE board_packet SET status = 'running', done_sites = ? WHERE id = ?", [doneSites, id]);
  }

  async finish(id: number, file: { storageKey: string; sizeBytes: number }): Promise<void> {
    await this.db.query(
      `UPDATE board_packet SET status = 'done', done_sites = total_sites, storage_key = ?, size_bytes = ?,
        finished_at = ? WHERE id = ?`,
      [file.storageKey, file.sizeBytes, new Date(), id],
    );
  }

  async fail(id: number, error: string): Promise<void> {
    await this.db.query("UPDATE board_packet SET status = 'failed', error = ?, finished_at = ? WHERE id = ?", [
      error.slice(0, 500),
      new Date(),
      id,
    ]);
  }

  /** The packet if it belongs to the organisation, with its storage key (never sent to the browser). */
  async find(organisationId: number, id: number): Promise<(BoardPacketDto & { storageKey: string | null }) | null> {
    const [row]: PacketRow[] = await this.db.query(`${SELECT} WHERE p.organisation_id = ? AND p.id = ?`, [
      organisationId,
      id,
    ]);
    return row ? { ...toDto(row), storageKey: row.storageKey } : null;
  }

  async list(
    organisationId: number,
    q: { month?: string; page: number; pageSize: number },
  ): Promise<{ items: BoardPacketDto[]; total: number }> {
    const where = q.month ? 'p.organisation_id = ? AND p.month = ?' : 'p.organisation_id = ?';
    const params = q.month ? [organisationId, q.month] : [organisationId];
    const [{ n }]: { n: number | string }[] = await this.db.query(
      `SELECT COUNT(*) AS n FROM board_packet p WHERE ${where}`,
      params,
    );
    const rows: PacketRow[] = await this.db.query(
      `${SELECT} WHERE ${where} ORDER BY p.created_at DESC, p.id DESC LIMIT ? OFFSET ?`,
      [...params, q.pageSize, q.page * q.pageSize],
    );
    return { items: rows.map(toDto), total: Number(n) };
  }
}

const SELECT = `SELECT p.id, p.organisation_id AS organisationId, p.month, p.title, p.site_ids AS siteIds, p.status,
  p.done_sites AS doneSites, p.total_sites AS totalSites, p.storage_key AS storageKey, p.size_bytes AS sizeBytes,
  p.error, p.created_by AS createdBy, u.display_name AS createdByName, p.created_at AS createdAt,
  p.finished_at AS finishedAt
  FROM board_packet p LEFT JOIN \`user\` u ON u.id = p.created_by`;

function toDto(r: PacketRow): BoardPacketDto {
  const createdAt = new Date(r.createdAt);
  const stalled = (r.status === 'queued' || r.status === 'running') && Date.now() - createdAt.getTime() > STALLED_MS;
  const total = Number(r.totalSites);
  const done = Number(r.doneSites);
  return {
    id: Number(r.id),
    month: r.month,
    title: r.title,
    siteIds: JSON.parse(r.siteIds) as number[],
    status: stalled ? 'failed' : r.status,
    doneSites: done,
    totalSites: total,
    progress: r.status === 'done' ? 1 : total ? done / (total + 1) : 0,
    sizeBytes: r.sizeBytes === null ? null : Number(r.sizeBytes),
    error: stalled ? 'The packet stopped before it was finished; start it again.' : r.error,
    createdBy: r.createdByName ?? 'Former user',
    createdAt: createdAt.toISOString(),
    finishedAt: r.finishedAt ? new Date(r.finishedAt).toISOString() : null,
  };
}
