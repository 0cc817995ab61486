import type { EntityManager } from 'typeorm';
import type { RejectionDto, UploadCounts, UploadSiteCounts } from '@shared/uploads/upload';
import type { Principal } from '../../../../platform/auth/principal';
import type { AuditRepository } from '../../../audit/data/audit-repository';
import type { DailyUseRepository } from '../../../readings/data/daily-use-repository';
import { INTERVAL_TARGET } from '../../data/ingest-targets';
import type { UploadsRepository } from '../../data/uploads-repository';
import { ownerSite, type IngestRefs } from '../ingest-refs';
import type { Merged } from './merge';
import type { Staged } from './stage';

export interface RecordInput {
  uploadId: number;
  principal: Principal;
  organisationId: number;
  /** The site of a site's upload; null for an organisation's. */
  siteId: number | null;
  fileName: string;
  refs: IngestRefs;
  staged: Staged;
  merged: Merged;
  /** Decisions and unknown meters, listed first. */
  notices: RejectionDto[];
  file: { sizeBytes: number; sha256: string; storageKey: string };
}

export interface RecordDeps {
  repo: UploadsRepository;
  dailyUse: DailyUseRepository;
  audit: AuditRepository;
}

type SiteCounts = Omit<UploadSiteCounts, 'siteName'>;

/** Per site: what the merge did to each owner (meter or zone), and the rows rejected for it. */
function siteCounts(input: RecordInput): SiteCounts[] {
  const bySite = new Map<number, SiteCounts>();
  const site = (id: number) => {
    let c = bySite.get(id);
    if (!c) bySite.set(id, (c = { siteId: id, accepted: 0, duplicate: 0, conflicting: 0, rejected: 0 }));
    return c;
  };
  const siteOf = ownerSite(input.refs, input.staged.target.owner);
  for (const [ownerId, counts] of input.merged.byOwner) {
    const id = siteOf(ownerId) ?? input.siteId;
    if (id === null || id === undefined) continue;
    site(id).accepted += counts.accepted;
    site(id).duplicate += counts.duplicate;
    site(id).conflicting += counts.conflicting;
  }
  for (const [id, n] of input.staged.rejectedBySite) {
    const target = id ?? input.siteId;
    if (target !== null) site(target).rejected += n;
  }
  if (input.siteId !== null) site(input.siteId);
  return [...bySite.values()];
}

/** The daily rollups move with the readings, per site, in the same transaction. */
async function refreshRollups(em: EntityManager, input: RecordInput, dailyUse: DailyUseRepository): Promise<void> {
  const { staged } = input;
  if (staged.direct && staged.spans) {
    // A direct load's span may include readings withdrawn since; refreshing those days again changes nothing.
    const meterSite = ownerSite(input.refs, 'meter_id');
    const sites = new Set([...staged.spans.countsByMeter().keys()].map((m) => meterSite(m)));
    for (const siteId of sites) {
      const span = staged.spans.overall((m) => meterSite(m) === siteId);
      if (siteId !== undefined && span) await dailyUse.refresh(em, siteId, span.from, span.to);
    }
    return;
  }
  if (staged.target !== INTERVAL_TARGET && staged.kind !== 'register' && staged.kind !== 'billing') return;
  for (const span of await dailyUse.uploadSpansBySite(em, input.uploadId))
    await dailyUse.refresh(em, span.siteId, span.from, span.to);
}

/**
 * Record: the rollups, the rows needing attention, the counts (overall and per site) and the audit entry, all in
 * the upload's transaction. Returns the counts.
 */
export async function recordUpload(em: EntityManager, input: RecordInput, deps: RecordDeps): Promise<UploadCounts> {
  const { staged, merged } = input;
  const counts: UploadCounts = {
    rowsRead: staged.rowsRead,
    accepted: merged.accepted,
    duplicate: merged.duplicate,
    conflicting: merged.conflicting,
    replaced: merged.replaced,
    rejected: staged.rejected + merged.problems,
  };
  await refreshRollups(em, input, deps.dailyUse);
  await deps.repo.insertRejections(em, input.uploadId, [...input.notices, ...staged.rejections, ...merged.rejections]);
  await deps.repo.saveSiteCounts(em, input.uploadId, siteCounts(input));
  await deps.repo.finish(em, input.uploadId, {
    ...counts,
    status: 'done',
    kind: staged.kind,
    ...input.file,
    mapping: staged.mapping,
    errorSummary: null,
    unknownRefs: staged.unknownRefs.size,
  });
  await deps.audit.record(em, {
    userId: input.principal.userId,
    organisationId: input.organisationId,
    entity: 'upload',
    entityId: input.uploadId,
    action: 'import',
    changes: { siteId: input.siteId, fileName: input.fileName, ...counts },
  });
  return counts;
}
