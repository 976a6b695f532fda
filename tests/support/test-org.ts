import { afterAll, beforeAll } from 'vitest';
import { createOrganisation, signedInAgent, type TestOrg } from './factories';
import { createTestApp, type TestApp } from './test-app';

export interface OrgFixture {
  t: TestApp;
  org: TestOrg;
  /** The organisation's consultant, signed in. */
  agent: Awaited<ReturnType<typeof signedInAgent>>;
}

/**
 * The usual frame of an API test file: an app (with `env` on top of the test settings) and one
 * organisation with a user per role, its consultant signed in, made before the file's tests and
 * closed after them. Read the fields inside tests and hooks (they are set once the file starts).
 */
export function withOrganisation(env: Record<string, string> = {}): OrgFixture {
  const fixture = {} as OrgFixture;
  beforeAll(async () => {
    fixture.t = createTestApp(env);
    fixture.org = await createOrganisation(fixture.t.db);
    fixture.agent = await signedInAgent(fixture.t.app, fixture.org.users.consultant.email);
  });
  afterAll(() => fixture.t.close());
  return fixture;
}
