import type { DataSource } from 'typeorm';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { SiteShareEntity } from '../../backend/src/components/sites/data/site-share.entity';
import { SiteTagEntity } from '../../backend/src/components/sites/data/site-tag.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { MembershipEntity } from '../../backend/src/components/users/data/membership.entity';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';
import { hashPassword } from '../../backend/src/platform/auth/password';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_SITES, DEMO_USERS } from './demo-scenario';

/**
 * Writes the demo scenario. Idempotent: organisations, users and sites are matched by their unique
 * names and e-mails and brought back to the scenario's values; running it twice changes nothing more.
 */
export async function seedDemo(db: DataSource): Promise<{ organisations: number; users: number; sites: number }> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db.transaction(async (em) => {
    const orgIds = new Map<string, number>();
    for (const o of DEMO_ORGANISATIONS) {
      await em.getRepository(OrganisationEntity).upsert({ name: o.name, kind: o.kind }, ['name']);
      orgIds.set(o.key, (await em.getRepository(OrganisationEntity).findOneByOrFail({ name: o.name })).id);
    }
    for (const u of DEMO_USERS) {
      const users = em.getRepository(UserEntity);
      const existing = await users.findOneBy({ email: u.email });
      const id =
        existing?.id ??
        (await users.insert({ email: u.email, displayName: u.displayName, status: 'active', passwordHash }))
          .identifiers[0]!['id'];
      if (existing) await users.update({ id }, { displayName: u.displayName, status: 'active', passwordHash });
      await em
        .getRepository(MembershipEntity)
        .upsert({ userId: Number(id), organisationId: orgIds.get(u.organisation)!, role: u.role }, [
          'userId',
          'organisationId',
        ]);
    }
    for (const s of DEMO_SITES) {
      const organisationId = orgIds.get(s.organisation)!;
      const fields = {
        organisationId,
        name: s.name,
        kind: s.kind,
        address: s.address,
        timeZone: s.timeZone,
        notes: s.notes,
      };
      await em.getRepository(SiteEntity).upsert(fields, ['organisationId', 'name']);
      const site = await em.getRepository(SiteEntity).findOneByOrFail({ organisationId, name: s.name });
      await em.getRepository(SiteTagEntity).delete({ siteId: site.id });
      await em.getRepository(SiteTagEntity).insert(s.tags.map((tag) => ({ siteId: site.id, tag })));
      await em.getRepository(SiteShareEntity).delete({ siteId: site.id });
      if (s.shares.length) {
        await em.getRepository(SiteShareEntity).insert(
          s.shares.map((sh) => ({
            siteId: site.id,
            organisationId: orgIds.get(sh.organisation)!,
            access: sh.access,
          })),
        );
      }
    }
    return { organisations: DEMO_ORGANISATIONS.length, users: DEMO_USERS.length, sites: DEMO_SITES.length };
  });
}
