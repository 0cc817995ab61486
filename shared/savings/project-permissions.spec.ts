import { describe, expect, it } from 'vitest';
import type { SiteRelation } from '../auth/roles';
import { savingsProjectPermissions } from './project-permissions';

const owner: SiteRelation = { kind: 'owner' };
const partner: SiteRelation = { kind: 'shared', access: 'contribute' };
const project = (createdBy: number, status: 'planned' | 'installed' | 'archived' = 'planned') => ({
  createdBy,
  status,
});

describe('savings project permissions', () => {
  it("when a contractor looks at the owner's project, then they may not edit, lock, archive or delete it", () => {
    for (const relation of [owner, partner])
      expect(savingsProjectPermissions({ role: 'contractor', relation, userId: 7, project: project(1) })).toEqual({
        edit: false,
        changeBaseline: false,
        markInstalled: false,
        archive: false,
        remove: false,
      });
  });

  it('when a contractor wrote the project, they edit it until installed, never a locked baseline', () => {
    const mine = (status: 'planned' | 'installed') =>
      savingsProjectPermissions({ role: 'contractor', relation: partner, userId: 7, project: project(7, status) });
    expect(mine('planned')).toEqual({
      edit: true,
      changeBaseline: true,
      markInstalled: true,
      archive: false,
      remove: true,
    });
    expect(mine('installed')).toEqual({
      edit: true,
      changeBaseline: false,
      markInstalled: false,
      archive: false,
      remove: false,
    });
  });

  it("when the owner's manager looks, then they may change a locked baseline and archive, but not delete it", () => {
    expect(
      savingsProjectPermissions({ role: 'manager', relation: owner, userId: 2, project: project(7, 'installed') }),
    ).toEqual({ edit: true, changeBaseline: true, markInstalled: false, archive: true, remove: false });
  });

  it('when the project is archived, then only the owner may restore it and nobody edits it', () => {
    expect(
      savingsProjectPermissions({ role: 'admin', relation: owner, userId: 2, project: project(2, 'archived') }),
    ).toEqual({ edit: false, changeBaseline: false, markInstalled: false, archive: true, remove: false });
    expect(
      savingsProjectPermissions({ role: 'contractor', relation: partner, userId: 7, project: project(7, 'archived') })
        .edit,
    ).toBe(false);
  });

  it('when an auditor reads, then nothing is allowed', () => {
    const can = savingsProjectPermissions({ role: 'auditor', relation: owner, userId: 3, project: project(3) });
    expect(Object.values(can).some(Boolean)).toBe(false);
  });
});
