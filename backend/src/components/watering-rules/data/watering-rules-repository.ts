import type { DataSource, EntityManager } from 'typeorm';
import type {
  DayMode,
  RuleAssignment,
  SiteRule,
  WateringRule,
  WateringRuleDto,
} from '@shared/watering-rules/watering-rule';
import type { WateringRuleInput } from '@shared/watering-rules/watering-rule';

interface RuleRow {
  id: number;
  name: string;
  stage: string;
  day_mode: DayMode;
  weekdays: string;
  start_hour: number;
  end_hour: number;
  max_station_minutes: number | null;
  in_force_from: string;
  in_force_to: string | null;
  updated_at: Date;
}

interface AssignmentRow {
  rule_id: number;
  site_id: number;
  site_name: string;
  address_number: number | null;
  assigned_weekdays: string;
}

const RULE_COLUMNS = `r.id, r.name, r.stage, r.day_mode, r.weekdays, r.start_hour, r.end_hour, r.max_station_minutes,
  DATE_FORMAT(r.in_force_from, '%Y-%m-%d') AS in_force_from, DATE_FORMAT(r.in_force_to, '%Y-%m-%d') AS in_force_to,
  r.updated_at`;

export type RuleSort = 'name' | 'from';
const SORTS: Record<RuleSort, string> = { name: 'r.name', from: 'r.in_force_from' };

/** Watering rules of an agency (its organisation) and the sites under them. Plain objects out. */
export class WateringRulesRepository {
  constructor(private readonly db: DataSource) {}

  async list(
    organisationId: number,
    q: { page: number; pageSize: number; sort: RuleSort; dir: 'asc' | 'desc'; q?: string | undefined },
  ): Promise<{ items: WateringRuleDto[]; total: number }> {
    const where = ['r.organisation_id = ?'];
    const params: unknown[] = [organisationId];
    if (q.q) {
      where.push('(r.name LIKE ? OR r.stage LIKE ?)');
      params.push(`%${q.q}%`, `%${q.q}%`);
    }
    const base = `FROM watering_rule r WHERE ${where.join(' AND ')}`;
    const [{ n }] = (await this.db.query(`SELECT COUNT(*) AS n ${base}`, params)) as [{ n: string }];
    const rows: RuleRow[] = await this.db.query(
      `SELECT ${RULE_COLUMNS} ${base} ORDER BY ${SORTS[q.sort]} ${q.dir === 'desc' ? 'DESC' : 'ASC'}, r.id
        LIMIT ? OFFSET ?`,
      [...params, q.pageSize, q.page * q.pageSize],
    );
    return { items: await this.withSites(rows), total: Number(n) };
  }

  async get(organisationId: number, id: number): Promise<WateringRuleDto | null> {
    const rows: RuleRow[] = await this.db.query(
      `SELECT ${RULE_COLUMNS} FROM watering_rule r WHERE r.id = ? AND r.organisation_id = ?`,
      [id, organisationId],
    );
    return (await this.withSites(rows))[0] ?? null;
  }

  async insert(em: EntityManager, organisationId: number, userId: number, input: WateringRuleInput): Promise<number> {
    const r: { insertId: number } = await em.query(
      `INSERT INTO watering_rule (organisation_id, name, stage, day_mode, weekdays, start_hour, end_hour,
        max_station_minutes, in_force_from, in_force_to, updated_by) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [organisationId, ...ruleValues(input), userId],
    );
    await this.saveSites(em, r.insertId, input.sites);
    return r.insertId;
  }

  async update(em: EntityManager, id: number, userId: number, input: WateringRuleInput): Promise<void> {
    await em.query(
      `UPDATE watering_rule SET name = ?, stage = ?, day_mode = ?, weekdays = ?, start_hour = ?, end_hour = ?,
        max_station_minutes = ?, in_force_from = ?, in_force_to = ?, updated_by = ? WHERE id = ?`,
      [...ruleValues(input), userId, id],
    );
    await em.query('DELETE FROM watering_rule_site WHERE rule_id = ?', [id]);
    await this.saveSites(em, id, input.sites);
  }

  async remove(em: EntityManager, id: number): Promise<void> {
    await em.query('DELETE FROM watering_rule WHERE id = ?', [id]);
  }

  /** Sites under any of the organisation's rules. */
  async siteIdsOf(organisationId: number): Promise<number[]> {
    const rows: { site_id: number }[] = await this.db.query(
      `SELECT DISTINCT rs.site_id FROM watering_rule_site rs JOIN watering_rule r ON r.id = rs.rule_id
        WHERE r.organisation_id = ?`,
      [organisationId],
    );
    return rows.map((r) => r.site_id);
  }

  /** Every stage of every agency's rule that the site is under, for the watch. */
  async siteRules(siteId: number): Promise<SiteRule[]> {
    const rows: (RuleRow & AssignmentRow)[] = await this.db.query(
      `SELECT ${RULE_COLUMNS}, rs.rule_id, rs.site_id, '' AS site_name, rs.address_number, rs.assigned_weekdays
        FROM watering_rule_site rs JOIN watering_rule r ON r.id = rs.rule_id WHERE rs.site_id = ?`,
      [siteId],
    );
    return rows.map((row) => ({ rule: toRule(row), assignment: toAssignment(row) }));
  }

  private async saveSites(em: EntityManager, ruleId: number, sites: readonly RuleAssignment[]): Promise<void> {
    if (sites.length === 0) return;
    await em.query('INSERT INTO watering_rule_site (rule_id, site_id, address_number, assigned_weekdays) VALUES ?', [
      sites.map((s) => [ruleId, s.siteId, s.addressNumber, s.assignedWeekdays.join(',')]),
    ]);
  }

  private async withSites(rows: RuleRow[]): Promise<WateringRuleDto[]> {
    if (rows.length === 0) return [];
    const sites: AssignmentRow[] = await this.db.query(
      `SELECT rs.rule_id, rs.site_id, s.name AS site_name, rs.address_number, rs.assigned_weekdays
        FROM watering_rule_site rs JOIN site s ON s.id = rs.site_id WHERE rs.rule_id IN (?) ORDER BY s.name`,
      [rows.map((r) => r.id)],
    );
    return rows.map((r) => ({
      ...toRule(r),
      sites: sites.filter((s) => s.rule_id === r.id).map((s) => ({ ...toAssignment(s), siteName: s.site_name })),
      updatedAt: r.updated_at.toISOString(),
    }));
  }
}

function ruleValues(input: WateringRuleInput): unknown[] {
  return [
    input.name,
    input.stage,
    input.dayMode,
    input.weekdays.join(','),
    input.allowedHours.startHour,
    input.allowedHours.endHour,
    input.maxStationMinutes,
    input.inForceFrom,
    input.inForceTo,
  ];
}

const days = (s: string): number[] => (s ? s.split(',').map(Number) : []);

function toRule(r: RuleRow): WateringRule {
  return {
    id: r.id,
    name: r.name,
    stage: r.stage,
    dayMode: r.day_mode,
    weekdays: days(r.weekdays),
    allowedHours: { startHour: r.start_hour, endHour: r.end_hour },
    maxStationMinutes: r.max_station_minutes,
    inForceFrom: r.in_force_from,
    inForceTo: r.in_force_to,
  };
}

function toAssignment(r: AssignmentRow): RuleAssignment {
  return { siteId: r.site_id, addressNumber: r.address_number, assignedWeekdays: days(r.assigned_weekdays) };
}
