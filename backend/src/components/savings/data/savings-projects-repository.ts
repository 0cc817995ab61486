import type { DataSource, EntityManager } from 'typeorm';
import type { SavingsProjectInput } from '@shared/savings/savings-project-dto';
import { SavingsProjectEntity } from './savings-project.entity';

export type SavingsProjectRecord = SavingsProjectEntity;

/** Data access for savings projects; callers check site access first. */
export class SavingsProjectsRepository {
  constructor(private readonly db: DataSource) {}

  ofSite(siteId: number): Promise<SavingsProjectRecord[]> {
    return this.db
      .getRepository(SavingsProjectEntity)
      .find({ where: { siteId }, order: { installedOn: 'DESC', id: 'DESC' } });
  }

  find(id: number): Promise<SavingsProjectRecord | null> {
    return this.db.getRepository(SavingsProjectEntity).findOneBy({ id });
  }

  async insert(em: EntityManager, siteId: number, createdBy: number, input: SavingsProjectInput): Promise<number> {
    const result = await em
      .getRepository(SavingsProjectEntity)
      .insert({ ...input, changeDescription: input.changeDescription ?? '', siteId, createdBy });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, patch: Partial<SavingsProjectInput>): Promise<void> {
    if (Object.keys(patch).length) await em.getRepository(SavingsProjectEntity).update({ id }, patch);
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(SavingsProjectEntity).delete({ id });
  }
}
