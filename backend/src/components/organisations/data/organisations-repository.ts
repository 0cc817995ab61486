import type { DataSource, EntityManager } from 'typeorm';
import type { UnitSystem } from '@shared/budgets/budget-dto';
import type { DateOrder } from '@shared/ingest/date-order';
import { OrganisationEntity } from './organisation.entity';

export class OrganisationsRepository {
  constructor(private readonly db: DataSource) {}

  async settings(organisationId: number): Promise<{
    organisationId: number;
    organisationName: string;
    unitSystem: UnitSystem;
    dateOrder: DateOrder | null;
  } | null> {
    const org = await this.db.getRepository(OrganisationEntity).findOneBy({ id: organisationId });
    return org
      ? { organisationId: org.id, organisationName: org.name, unitSystem: org.unitSystem, dateOrder: org.dateOrder }
      : null;
  }

  async setDateOrder(em: EntityManager, organisationId: number, dateOrder: DateOrder | null): Promise<void> {
    await em.getRepository(OrganisationEntity).update({ id: organisationId }, { dateOrder });
  }

  async setUnitSystem(em: EntityManager, organisationId: number, unitSystem: UnitSystem): Promise<void> {
    await em.getRepository(OrganisationEntity).update({ id: organisationId }, { unitSystem });
  }
}
