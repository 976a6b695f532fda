import { afterAll, beforeAll } from 'vitest';
import { launchBrowser, type BrowserWindow } from './browser';
import { createOrganisation, type TestOrg } from './factories';
import { startTeamHarness, type TeamHarness } from './team-harness';

export interface TeamBrowser {
  /** The app serving the built client, with the payment fake and the mail catcher. */
  h: TeamHarness;
  browser: BrowserWindow;
  org: TestOrg;
}

/** The frame of a browser test that needs mail or payments: made before the file's tests, closed after them. */
export function withTeamBrowser(): TeamBrowser {
  const frame = {} as TeamBrowser;
  beforeAll(async () => {
    frame.h = await startTeamHarness({ CLIENT_DIR: 'dist' });
    frame.browser = await launchBrowser();
    frame.org = await createOrganisation(frame.h.t.db);
  });
  afterAll(async () => {
    await frame.browser?.close();
    await frame.h?.close();
  });
  return frame;
}
