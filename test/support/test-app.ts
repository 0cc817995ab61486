import { randomBytes } from 'node:crypto';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Role, ShareAccess, OrganisationKind } from '@shared/auth/roles';
import type { SiteKind } from '@shared/sites/site';
import type { Config } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { SiteShareEntity } from '../../backend/src/components/sites/data/site-share.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { MembershipEntity } from '../../backend/src/components/users/data/membership.entity';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';
import { hashPassword } from '../../backend/src/platform/auth/password';
import { startServer, type RunningServer } from '../../backend/src/server';
import { testConfig } from './test-env';

export const TEST_PASSWORD = 'correct-horse-battery-9';
let passwordHash: Promise<string> | undefined;

export const suffix = () => randomBytes(4).toString('hex');

/** A running app on a free port plus a DataSource for building fixtures. */
export interface TestApp {
  server: RunningServer;
  db: DataSource;
  config: Config;
  stop(): Promise<void>;
}

export async function createTestApp(overrides: Record<string, string | undefined> = {}): Promise<TestApp> {
  const config = testConfig(overrides);
  const server = await startServer(config);
  const db = createDataSource(config.db);
  await connectWithRetry(db, { attempts: 5 });
  return { server, db, config, stop: async () => (await server.stop(), await db.destroy()) };
}

/** A supertest agent that keeps cookies and sends the CSRF header the way the Angular app does. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  private csrf = '';

  constructor(readonly baseUrl: string) {
    this.agent = request.agent(baseUrl);
  }

  async fetchCsrf(): Promise<void> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.csrf = res.body.token;
  }

  async signIn(email: string, password = TEST_PASSWORD) {
    if (!this.csrf) await this.fetchCsrf();
    const res = await this.post('/api/auth/sign-in', { email, password });
    this.pickCsrf(res.headers['set-cookie']);
    return res;
  }

  get(path: string) {
    return this.agent.get(path);
  }

  post(path: string, body?: object) {
    return this.agent
      .post(path)
      .set('x-xsrf-token', this.csrf)
      .send(body ?? {});
  }

  /** A raw text body, e.g. a CSV upload. */
  postText(path: string, text: string, contentType = 'text/csv') {
    return this.agent.post(path).set('x-xsrf-token', this.csrf).set('content-type', contentType).send(text);
  }

  patch(path: string, body: object) {
    return this.agent.patch(path).set('x-xsrf-token', this.csrf).send(body);
  }

  put(path: string, body: object) {
    return this.agent.put(path).set('x-xsrf-token', this.csrf).send(body);
  }

  /** A POST for `.field()`/`.attach()` multipart bodies, with the CSRF header. */
  multipart(path: string) {
    return this.agent.post(path).set('x-xsrf-token', this.csrf);
  }

  delete(path: string) {
    return this.agent.delete(path).set('x-xsrf-token', this.csrf);
  }

  /** The server sends a fresh token cookie whenever the session id changes (sign-in, sign-out). */
  pickCsrf(setCookie: string[] | string | undefined): void {
    const cookies = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
    const found = cookies.map((c) => /^XSRF-TOKEN=([^;]+)/.exec(c)?.[1]).find(Boolean);
    if (found) this.csrf = decodeURIComponent(found);
  }
}

export interface World {
  org: { id: number; name: string };
  users: Record<Role, { id: number; email: string }>;
}

export async function createOrganisation(
  db: DataSource,
  kind: OrganisationKind = 'property-manager',
  label = 'Org',
): Promise<{ id: number; name: string }> {
  const name = `${label} ${suffix()}`;
  const id = Number((await db.getRepository(OrganisationEntity).insert({ name, kind })).identifiers[0]!['id']);
  return { id, name };
}

export async function createUser(
  db: DataSource,
  organisationId: number,
  role: Role,
  status: 'active' | 'disabled' = 'active',
): Promise<{ id: number; email: string }> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const email = `${role}-${suffix()}@test.example`;
  const id = Number(
    (
      await db
        .getRepository(UserEntity)
        .insert({ email, displayName: `Test ${role}`, status, passwordHash: await passwordHash })
    ).identifiers[0]!['id'],
  );
  await db.getRepository(MembershipEntity).insert({ userId: id, organisationId, role });
  return { id, email };
}

/** An organisation with one active user of every role. */
export async function createWorld(db: DataSource, kind: OrganisationKind = 'property-manager'): Promise<World> {
  const org = await createOrganisation(db, kind);
  const users = {} as World['users'];
  for (const role of ['admin', 'manager', 'contractor', 'auditor'] as Role[])
    users[role] = await createUser(db, org.id, role);
  return { org, users };
}

export async function createSite(
  db: DataSource,
  organisationId: number,
  fields: Partial<{ name: string; kind: SiteKind; timeZone: string }> = {},
): Promise<{ id: number; name: string }> {
  const name = fields.name ?? `Site ${suffix()}`;
  const id = Number(
    (
      await db.getRepository(SiteEntity).insert({
        organisationId,
        name,
        kind: fields.kind ?? 'park',
        address: '1 Test Way, Nowhere',
        timeZone: fields.timeZone ?? 'America/Los_Angeles',
        notes: '',
      })
    ).identifiers[0]!['id'],
  );
  return { id, name };
}

export async function shareSite(
  db: DataSource,
  siteId: number,
  organisationId: number,
  access: ShareAccess,
): Promise<void> {
  await db.getRepository(SiteShareEntity).insert({ siteId, organisationId, access });
}

export async function signedIn(app: TestApp, email: string): Promise<Client> {
  const client = new Client(app.server.url);
  const res = await client.signIn(email);
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}
