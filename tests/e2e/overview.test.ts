import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';
import { seedDemoWorld } from '../support/demo-world';
import { createOrganisation, TEST_PASSWORD } from '../support/factories';

// The overview shows each role its work: catchments with runs and calibration, briefings, lab jobs, the seat plan.
let b: BrowserSession;
let catchmentId: number;
let briefingId: number;
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;

beforeAll(async () => {
  b = await openBrowser();
  ({ catchment: catchmentId, briefing: briefingId } = await seedDemoWorld(b.t.db));
  // The overview lists the most recently changed catchments: other browser tests add catchments to the demo organisation.
  await b.t.db('catchments').where('id', catchmentId).update({ updated_at: new Date() });
});
afterAll(async () => {
  await b?.close();
});

async function overviewOf(role: string) {
  const page = await b.newPage();
  await signInThroughForm(page, b.baseUrl, account(role).email, account(role).password);
  await page.waitForSelector('[data-test=overview-catchments], [data-test=overview-briefings]');
  return page;
}

describe('the overview', () => {
  it("shows a consultant the catchment's runs and calibration and the briefings, and opens them", async () => {
    const page = await overviewOf('consultant');
    const catchment = page.locator(`[data-test=overview-catchment-${catchmentId}]`);
    await expect.poll(() => catchment.innerText()).toContain(DEMO_CATCHMENT.name);
    const text = await catchment.innerText();
    expect(text).toMatch(/Calibrated on \d{1,2} \w{3,4} \d{4} \(daily KGE 0\.\d{2,3}\)/);
    // The newest runs of the catchment, each with its state in words.
    expect(text).toMatch(/ · finished · \d{1,2} \w{3,4} \d{4}/);
    expect(await page.locator(`[data-test=overview-briefing-${briefingId}]`).innerText()).toContain(DEMO_BRIEFING.title);
    expect(await page.locator('[data-test=overview-plan]').count()).toBe(0);
    await catchment.click();
    await page.waitForURL(new RegExp(`/catchments/${catchmentId}$`));
    await page.close();
  });

  it('shows the admin the seat plan in use', async () => {
    const page = await overviewOf('admin');
    await expect.poll(() => page.locator('[data-test=overview-plan]').innerText()).toMatch(/\d+ of \d+ paid seats in use · active · renews/);
    await page.close();
  });

  it('shows a scientist catchments and lab jobs, and no briefings', async () => {
    const page = await overviewOf('scientist');
    await page.waitForSelector('[data-test=overview-lab]');
    expect(await page.locator('[data-test=overview-briefings]').count()).toBe(0);
    await page.close();
  });

  it('shows a client only the briefings shared with them', async () => {
    const page = await overviewOf('client');
    await expect.poll(() => page.locator('[data-test=overview-briefings]').innerText()).toContain(DEMO_BRIEFING.title);
    expect(await page.locator('[data-test=overview-catchments]').count()).toBe(0);
    await page.locator(`[data-test=overview-briefing-${briefingId}]`).click();
    await page.waitForURL(new RegExp(`/briefings/${briefingId}`));
    await page.close();
  });

  it('tells a new team what to do first', async () => {
    const org = await createOrganisation(b.t.db);
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, org.users.consultant.email, TEST_PASSWORD);
    const catchments = page.locator('[data-test=overview-catchments]');
    await expect.poll(() => catchments.innerText()).toContain('No catchments yet');
    expect(await catchments.innerText()).toContain('Create a catchment');
    expect(await page.locator('[data-test=overview-briefings]').innerText()).toContain('No briefings yet');
    await page.close();
  });
});
