import type { DataSource, EntityManager } from 'typeorm';
import type { SavingsProjectInput, SavingsProjectStatus } from '@shared/savings/savings-project-dto';
import { SavingsProjectEntity } from './savings-project.entity';

/** A project as the data layer returns it, with who wrote it and for which organisation. */
export interface SavingsProjectRecord {
  id: number;
  siteId: number;
  title: string;
  changeKind: string;
  changeDescription: string;
  installedOn: string | Date;
  baselineFrom: string;
  baselineTo: string;
  reportingFrom: string;
  reportingTo: string;
  modelForm: string;
  status: SavingsProjectStatus;
  lockedAt: Date | null;
  archivedAt: Date | null;
  retrofits: string[];
  installedCost: number | null;
  costCurrency: string | null;
  createdBy: number | null;
  createdByName: string | null;
  createdByOrganisation: string | null;
  createdAt: Date;
  updatedAt: Date;
}

// The author's organisation among those that can see the site (the owner or a sharing partner).
const COLUMNS = `p.id, p.site_id AS siteId, p.title, p.change_kind AS changeKind,
  p.change_description AS changeDescription, p.installed_on AS installedOn, p.baseline_from AS baselineFrom,
  p.baseline_to AS baselineTo, p.reporting_from AS reportingFrom, p.reporting_to AS reportingTo,
  p.model_form AS modelForm, p.status, p.locked_at AS lockedAt, p.archived_at AS archivedAt, p.retrofits,
  p.installed_cost AS installedCost, p.cost_currency AS costCurrency, p.created_by AS createdBy,
  u.display_name AS createdByName, p.created_at AS createdAt, p.updated_at AS updatedAt,
  (SELECT o.name FROM membership m JOIN organisation o ON o.id = m.organisation_id JOIN site s ON s.id = p.site_id
    LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = m.organisation_id
    WHERE m.user_id = p.created_by AND (s.organisation_id = m.organisation_id OR sh.organisation_id IS NOT NULL)
    ORDER BY s.organisation_id = m.organisation_id, m.organisation_id LIMIT 1) AS createdByOrganisation`;
const FROM = 'FROM savings_project p LEFT JOIN `user` u ON u.id = p.created_by';

type Stored = Omit<SavingsProjectRecord, 'retrofits' | 'installedCost'> & {
  retrofits: string | null;
  installedCost: string | number | null;
};

/** Data access for savings projects; callers check site access first. */
export class SavingsProjectsRepository {
  constructor(private readonly db: DataSource) {}

  async ofSite(siteId: number): Promise<SavingsProjectRecord[]> {
    return this.ofSites([siteId]);
  }

  /** Projects on these sites, newest installation first; `authorOrganisationId` keeps those its members wrote. */
  async ofSites(siteIds: number[], authorOrganisationId?: number): Promise<SavingsProjectRecord[]> {
    if (!siteIds.length) return [];
    const mine =
      authorOrganisationId === undefined
        ? ''
        : 'AND EXISTS (SELECT 1 FROM membership am WHERE am.user_id = p.created_by AND am.organisation_id = ?)';
    const rows: Stored[] = await this.db.query(
      `SELECT ${COLUMNS} ${FROM} WHERE p.site_id IN (?) ${mine} ORDER BY p.installed_on DESC, p.id DESC`,
      authorOrganisationId === undefined ? [siteIds] : [siteIds, authorOrganisationId],
    );
    return rows.map(toRecord);
  }

  async find(id: number): Promise<SavingsProjectRecord | null> {
    const [row]: Stored[] = await this.db.query(`SELECT ${COLUMNS} ${FROM} WHERE p.id = ?`, [id]);
    return row ? toRecord(row) : null;
  }

  async insert(em: EntityManager, siteId: number, createdBy: number, input: SavingsProjectInput): Promise<number> {
    const result = await em.getRepository(SavingsProjectEntity).insert({
      ...columnsOf(input),
      changeDescription: input.changeDescription ?? '',
      siteId,
      createdBy,
    });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, patch: Partial<SavingsProjectInput>): Promise<void> {
    const columns = columnsOf(patch);
    if (Object.keys(columns).length) await em.getRepository(SavingsProjectEntity).update({ id }, columns);
  }

  async markInstalled(em: EntityManager, id: number, userId: number): Promise<void> {
    await em
      .getRepository(SavingsProjectEntity)
      .update({ id }, { status: 'installed', lockedAt: new Date(), lockedBy: userId });
  }

  /** Archives, or restores to what it was before (installed when it had been locked). */
  async setArchived(em: EntityManager, id: number, archived: boolean, userId: number): Promise<void> {
    await em.query(
      `UPDATE savings_project SET status = IF(?, 'archived', IF(locked_at IS NULL, 'planned', 'installed')),
        archived_at = IF(?, ?, NULL), archived_by = IF(?, ?, NULL) WHERE id = ?`,
      [archived, archived, new Date(), archived, userId, id],
    );
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(SavingsProjectEntity).delete({ id });
  }
}

function columnsOf(input: Partial<SavingsProjectInput>): Partial<SavingsProjectEntity> {
  const { retrofits, ...rest } = input;
  return retrofits === undefined ? rest : { ...rest, retrofits: JSON.stringify(retrofits) };
}

function toRecord(r: Stored): SavingsProjectRecord {
  return {
    ...r,
    id: Number(r.id),
    siteId: Number(r.siteId),
    createdBy: r.createdBy === null ? null : Number(r.createdBy),
    retrofits: r.retrofits ? (JSON.parse(r.retrofits) as string[]) : [],
    installedCost: r.installedCost === null ? null : Number(r.installedCost),
  };
}
