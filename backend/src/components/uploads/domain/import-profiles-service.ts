import type { DataSource } from 'typeorm';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import type { ImportProfileDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { UploadsRepository } from '../data/uploads-repository';

/** Named column mappings an organisation reuses; anyone who may upload may save or delete one. */
export class ImportProfilesService {
  constructor(
    private readonly db: DataSource,
    private readonly repo: UploadsRepository,
    private readonly audit: AuditRepository,
  ) {}

  list(principal: Principal): Promise<ImportProfileDto[]> {
    return this.repo.profiles(principal.organisationId);
  }

  async create(principal: Principal, name: string, mapping: ColumnMapping): Promise<ImportProfileDto> {
    this.assertMayUpload(principal);
    if (await this.repo.profileNameTaken(principal.organisationId, name)) {
      throw new AppError('conflict', `An import profile named "${name}" already exists.`, [
        { field: 'name', message: 'is already used' },
      ]);
    }
    const id = await this.db.transaction(async (em) => {
      const profileId = await this.repo.insertProfile(em, principal.organisationId, principal.userId, name, mapping);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'import-profile',
        entityId: profileId,
        action: 'create',
        changes: { name, kind: mapping.kind },
      });
      return profileId;
    });
    return (await this.repo.profiles(principal.organisationId)).find((p) => p.id === id)!;
  }

  async remove(principal: Principal, id: number): Promise<void> {
    this.assertMayUpload(principal);
    await this.db.transaction(async (em) => {
      if (!(await this.repo.deleteProfile(em, principal.organisationId, id))) throw AppError.notFound('Import profile');
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'import-profile',
        entityId: id,
        action: 'delete',
      });
    });
  }

  private assertMayUpload(principal: Principal): void {
    if (principal.role === 'auditor')
      throw AppError.forbidden('Auditors cannot upload, so they cannot save import profiles.');
  }
}
