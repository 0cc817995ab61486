import { createHash, randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { ApiKeySiteEntity } from '../../backend/src/components/api-keys/data/api-key-site.entity';
import { ApiKeyEntity } from '../../backend/src/components/api-keys/data/api-key.entity';
import { MeterEntity } from '../../backend/src/components/meters/data/meter.entity';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { MembershipEntity } from '../../backend/src/components/users/data/membership.entity';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';

/** An invented organisation, admin, site (Phoenix: no DST) and meters for the benchmark; reused across runs. */
export async function seedBenchWorld(db: DataSource, meters: number) {
  await db.getRepository(OrganisationEntity).upsert({ name: 'Bench Organisation', kind: 'property-manager' }, ['name']);
  const org = await db.getRepository(OrganisationEntity).findOneByOrFail({ name: 'Bench Organisation' });
  const email = 'bench.admin@bench.example';
  let user = await db.getRepository(UserEntity).findOneBy({ email });
  if (!user) {
    await db
      .getRepository(UserEntity)
      .insert({ email, displayName: 'Bench Admin', status: 'active', passwordHash: 'not-used' });
    user = await db.getRepository(UserEntity).findOneByOrFail({ email });
  }
  await db
    .getRepository(MembershipEntity)
    .upsert({ userId: user.id, organisationId: org.id, role: 'admin' }, ['userId', 'organisationId']);
  await db.getRepository(SiteEntity).upsert(
    {
      organisationId: org.id,
      name: 'Bench Site',
      kind: 'park',
      address: '1 Bench Row',
      timeZone: 'America/Phoenix',
      notes: '',
    },
    ['organisationId', 'name'],
  );
  const site = await db.getRepository(SiteEntity).findOneByOrFail({ organisationId: org.id, name: 'Bench Site' });
  const meterRefs = Array.from({ length: meters }, (_, i) => `BENCH-${String(i + 1).padStart(4, '0')}`);
  await db.getRepository(MeterEntity).upsert(
    meterRefs.map((ref) => ({
      siteId: site.id,
      ref,
      unit: 'gal' as const,
      registerMultiplier: 1,
      registerDigits: null,
      purpose: 'dedicated-irrigation' as const,
      waterSource: 'potable' as const,
      installedAt: null,
      removedAt: null,
    })),
    ['siteId', 'ref'],
  );
  const rows = await db.getRepository(MeterEntity).findBy({ siteId: site.id });
  const meterIds = meterRefs.map((ref) => rows.find((r) => r.ref === ref)!.id);
  return {
    siteId: site.id,
    meterRefs,
    meterIds,
    /** A fresh key for this run, made the way the API makes them (hash only). */
    async apiKey(): Promise<string> {
      const prefix = `rk_${randomBytes(4).toString('hex')}`;
      const secret = `${prefix}_${randomBytes(32).toString('base64url')}`;
      const id = Number(
        (
          await db.getRepository(ApiKeyEntity).insert({
            organisationId: org.id,
            name: `bench ${prefix}`,
            prefix,
            secretHash: createHash('sha256').update(secret).digest('hex'),
            createdBy: user!.id,
          })
        ).identifiers[0]!['id'],
      );
      await db.getRepository(ApiKeySiteEntity).insert({ apiKeyId: id, siteId: site.id });
      return secret;
    },
  };
}
