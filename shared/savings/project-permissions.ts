/**
 * Who may do what with a savings project. Contractors edit the projects they wrote; the site owner's managers and
 * administrators may edit any project on their sites, are the only ones who change a locked baseline, and archive
 * projects. Deleting is for projects not yet installed: after that the record is archived, never lost.
 */
import { atLeast, siteLevel, type Role, type SiteRelation } from '../auth/roles';
import type { SavingsProjectPermissions, SavingsProjectStatus } from './savings-project-dto';

export interface PermissionInput {
  role: Role;
  relation: SiteRelation;
  userId: number;
  project: { createdBy: number | null; status: SavingsProjectStatus };
}

export function savingsProjectPermissions({
  role,
  relation,
  userId,
  project,
}: PermissionInput): SavingsProjectPermissions {
  const level = siteLevel(role, relation);
  const ownerManager = relation.kind === 'owner' && atLeast(level, 'edit');
  const author = project.createdBy === userId && atLeast(level, 'contribute');
  if (project.status === 'archived')
    return { edit: false, changeBaseline: false, markInstalled: false, archive: ownerManager, remove: false };
  const edit = author || ownerManager;
  const planned = project.status === 'planned';
  return {
    edit,
    changeBaseline: planned ? edit : ownerManager,
    markInstalled: planned && edit,
    archive: ownerManager,
    remove: planned && edit,
  };
}
