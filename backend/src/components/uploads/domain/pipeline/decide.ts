import {
  decideDateOrder,
  describeDateOrder,
  type DateOrder,
  type DateOrderChoices,
  type DateOrderEvidence,
} from '@shared/ingest/date-order';
import type { RejectionDto } from '@shared/uploads/upload';
import { VOLUME_UNIT_LABELS } from '@shared/units/volume-units';
import { AppError } from '../../../../platform/app-error';
import type { IngestRefs } from '../ingest-refs';
import type { UnitFindings } from '../unit-findings';
import type { UnknownRefTally } from './stage';

/** What the decide step needs from a staged file. */
export interface StagedFacts {
  direct: boolean;
  staged: number;
  linesSent: number;
  /** The order numeric dates were read in (`mapping.dateOrder`), if any. */
  readOrder: DateOrder | undefined;
  dateEvidence: DateOrderEvidence;
  unknownRefs: Map<string, UnknownRefTally>;
  units: UnitFindings;
}

export type Decision =
  /** Nothing may be stored; say why (e.g. the date order is the person's to choose). */
  | { action: 'refuse'; error: AppError }
  /** Read the kept file again: through the stage (some lines met stored readings), or in the decided date order. */
  | { action: 'restage'; dateOrder?: DateOrder; reason: string }
  | { action: 'merge'; notices: RejectionDto[]; unknown: RejectionDto[] };

export interface DecideContext {
  fileName: string;
  choices: DateOrderChoices;
  refs: IngestRefs;
  /** An organisation's file (rows routed to many sites) rather than one site's. */
  organisationWide: boolean;
}

const notice = (message: string): RejectionDto => ({ row: 0, column: null, kind: 'notice', message });

/**
 * Decide: what the whole staged file says that no single row could — its day/month order (refuse and ask when the
 * dates cannot tell; read again when they show another order than the one read with), whether a direct load must
 * go through the stage after all, and the notices about units and unknown meters. Pure: no database.
 */
export function decideStaged(facts: StagedFacts, ctx: DecideContext): Decision {
  const dates = decideDateOrder(facts.dateEvidence, ctx.choices);
  if (dates.kind === 'ambiguous' || dates.kind === 'contradictory') {
    const why = describeDateOrder(dates);
    return {
      action: 'refuse',
      error: new AppError(
        'date_order_ambiguous',
        `"${ctx.fileName}": ${why} Send it again with dateOrder day-first or month-first; nothing was stored.`,
        [{ field: 'dateOrder', message: why }],
      ),
    };
  }
  if (dates.kind === 'decided' && dates.order !== (facts.readOrder ?? 'month-first')) {
    return { action: 'restage', dateOrder: dates.order, reason: `the file's dates are ${dates.order}` };
  }
  if (facts.direct && facts.staged < facts.linesSent) {
    return { action: 'restage', reason: 'some lines met stored readings or repeat within the file' };
  }
  const notices: RejectionDto[] = [];
  if (dates.kind === 'decided') notices.push(notice(describeDateOrder(dates)));
  notices.push(...unitNotices(facts.units, ctx.refs));
  return { action: 'merge', notices, unknown: unknownRefRejections(facts.unknownRefs, ctx) };
}

function meterNames(refs: IngestRefs): Map<number, { ref: string; unit: string }> {
  return new Map([...refs.meters.values()].map((m) => [m.id, { ref: m.ref, unit: VOLUME_UNIT_LABELS[m.unit] }]));
}

/** The meter's own unit used (the file names none), or a file unit the meter is not set up in: both said. */
export function unitNotices(units: UnitFindings, refs: IngestRefs): RejectionDto[] {
  const names = meterNames(refs);
  const out: RejectionDto[] = [];
  if (units.meterUnitUsed.size > 0) {
    const list = [...units.meterUnitUsed]
      .slice(0, 12)
      .map((id) => `${names.get(id)?.ref} in ${names.get(id)?.unit}`)
      .join(', ');
    const more = units.meterUnitUsed.size > 12 ? ` and ${units.meterUnitUsed.size - 12} more` : '';
    out.push(notice(`The file names no unit: each meter's own unit was used (${list}${more}).`));
  }
  for (const [meterId, fileUnits] of [...units.differing].slice(0, 50)) {
    const meter = names.get(meterId);
    const given = [...fileUnits].map((u) => VOLUME_UNIT_LABELS[u]).join(' and ');
    out.push(
      notice(
        `Meter ${meter?.ref} is set up in ${meter?.unit}, but the file gives its volumes in ${given}; ` +
          "the file's unit was used. Check the meter's unit or the file.",
      ),
    );
  }
  return out;
}

/** One line per meter or controller the file names that no site in scope has, with its rows. */
export function unknownRefRejections(unknown: Map<string, UnknownRefTally>, ctx: DecideContext): RejectionDto[] {
  return [...unknown.values()].map((u) => {
    const rows = u.firstRows.join(', ') + (u.rows > u.firstRows.length ? ', …' : '');
    const sites = ctx.refs.ambiguous.get(u.ref);
    const where = ctx.organisationWide ? 'any of your sites' : 'this site';
    const message = sites
      ? `${u.field} "${u.ref}" is set up on several sites (${sites.join(', ')}), so its ${u.rows} row(s) ` +
        `(rows ${rows}) cannot be routed; send its rows to one of those sites.`
      : `${u.field} "${u.ref}" is not set up on ${where}: ${u.rows} row(s) not imported (rows ${rows}). ` +
        `Create the ${u.field} on its site, then send the file again; what was imported stays as it is.`;
    return {
      row: u.firstRows[0] ?? 0,
      column: null,
      kind: 'unknown' as const,
      message,
      ref: { field: u.field, ref: u.ref, rows: u.rows },
    };
  });
}
