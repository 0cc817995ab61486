import type { DataSource, EntityManager } from 'typeorm';
import type { UnitSystem } from '@shared/budgets/budget-dto';
import { OrganisationEntity } from './organisation.entity';

export class OrganisationsRepository {
  constructor(private readonly db: DataSource) {}

  async settings(
    organisationId: number,
  ): Promise<{ organisationId: number; organisationName: string; unitSystem: UnitSystem } | null> {
    const org = await this.db.getRepository(OrganisationEntity).findOneBy({ id: organisationId });
    return org ? { organisationId: org.id, organisationName: org.name, unitSystem: org.unitSystem } : null;
  }

  async setUnitSystem(em: EntityManager, organisationId: number, unitSystem: UnitSystem): Promise<void> {
    await em.getRepository(OrganisationEntity).update({ id: organisationId }, { unitSystem });
  }
}
