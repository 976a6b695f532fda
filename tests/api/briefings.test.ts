import { PDFParse } from 'pdf-parse';
import type TestAgent from 'supertest/lib/agent';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS, ICE_DARKENING_CAUTION } from '../../shared/text/cautions';
import { SECTIONS, catchmentWithRun } from '../support/briefings';
import { createOrganisation, signedInAgent, unique, type TestOrg } from '../support/factories';
import { giveActivePlan, inventedValleyInputs, waitForRun } from '../support/runs';
import { startMailCatcher, type MailCatcher } from '../../server/services/mail/mail-catcher';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let catcher: MailCatcher;
let org: TestOrg;
let other: TestOrg;
let consultant: TestAgent;
let client: TestAgent;
let catchmentId: number;
let runId: number;
let briefingId: number;

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function anotherClient(organisationId: number): Promise<{ email: string; agent: TestAgent }> {
  const email = `${unique('client')}@test.example`;
  const hash = (await t.db('users').where({ id: org.users.client.id }).first('password_hash')).password_hash;
  await t.db('users').insert({ organisation_id: organisationId, email, name: 'Second client', role: 'client', status: 'active', password_hash: hash });
  return { email, agent: await signedInAgent(t.app, email) };
}

beforeAll(async () => {
  catcher = await startMailCatcher(0);
  t = createTestApp({ SMTP_PORT: String(catcher.port) }, { catchmentInputs: inventedValleyInputs, inbox: catcher });
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  await giveActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  client = await signedInAgent(t.app, org.users.client.email);
  ({ catchmentId, runId } = await catchmentWithRun(consultant));
  const created = await consultant.post('/api/briefings').send({ catchmentId, title: 'Soot on the glacier', summary: 'Darker ice, more **July** water.', selection: { runIds: [runId] } });
  expect(created.status).toBe(201);
  briefingId = created.body.briefing.id;
  const saved = await consultant.put(`/api/briefings/${briefingId}/draft`).send({ title: 'Soot on the glacier', summary: 'Darker ice, more **July** water.', selection: { runIds: [runId] }, sections: SECTIONS });
  expect(saved.status).toBe(200);
});
afterAll(async () => {
  await t.close();
  await catcher?.close();
});

describe('briefing drafts', () => {
  it('keep sections in the order saved and refuse bad sections by field', async () => {
    const draft = (await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing;
    expect(draft.sections.map((s: { heading: string }) => s.heading)).toEqual(['Added runoff by month', 'Totals', 'Notes']);
    const bad = await consultant.put(`/api/briefings/${briefingId}/draft`).send({ ...draft, sections: [{ kind: 'chart', heading: 'X', contentKey: 'nonsense' }] });
    expect(bad.status).toBe(422);
    expect(bad.body.error.field).toBe('sections.0.contentKey');
    expect((await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing.sections).toHaveLength(3);
  });

  it('refuse runs that are not finished variant runs of the catchment, by field, keeping what is stored', async () => {
    const draft = (await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing;
    const missing = await consultant.put(`/api/briefings/${briefingId}/draft`).send({ ...draft, selection: { runIds: [runId, 999999] } });
    expect(missing.status).toBe(422);
    expect(missing.body.error).toMatchObject({ field: 'selection.runIds.1', message: 'Run #999999 is not a run of this catchment.' });
    const created = await consultant.post('/api/briefings').send({ catchmentId, title: 'Other', selection: { runIds: [999999] } });
    expect(created.status).toBe(422);
    const baselineScenario = (await consultant.get(`/api/catchments/${catchmentId}/scenarios`)).body.scenarios[0];
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baselineScenario.id });
    const baselineRun = await waitForRun(consultant, catchmentId, started.body.run.id);
    const baseline = await consultant.put(`/api/briefings/${briefingId}/draft`).send({ ...draft, selection: { runIds: [baselineRun.id] } });
    expect(baseline.status).toBe(422);
    expect(baseline.body.error.message).toMatch(/is a baseline run; choose variant runs/);
    expect((await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing.selection).toEqual({ runIds: [runId] });
  });
});

describe('publishing', () => {
  it('freezes the content: later draft edits and runs do not change a published version', async () => {
    const published = await consultant.post(`/api/briefings/${briefingId}/publish`);
    expect(published.status).toBe(201);
    expect(published.body.version).toBe(1);
    const v1 = (await consultant.get(`/api/briefings/${briefingId}/versions/1`)).body;
    expect(v1.snapshot.headlines[0].variantName).toBe('Soot 400 ng/g');
    expect(v1.snapshot.headlines[0].addedVolumeM3.value).toBeGreaterThan(0);
    expect(v1.snapshot.cautions).toEqual([...CAUTIONS, ICE_DARKENING_CAUTION]);
    // The catchment was never calibrated: the warning stands above the numbers, and the set-up is frozen with them.
    expect(v1.snapshot.warnings).toEqual([expect.stringMatching(/^Soot 400 ng\/g: Not calibrated/)]);
    expect(v1.snapshot.assumptions.setUp[0].lines.map((l: { label: string }) => l.label)).toContain('Start');

    // Change the draft and the stored results under it: version 1 stays as it was.
    const draft = (await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing;
    await consultant.put(`/api/briefings/${briefingId}/draft`).send({ ...draft, title: 'Renamed', sections: [] });
    await t.db('run_daily').whereIn('member_id', t.db('run_members').where({ run_id: runId }).select('id')).update({ snow_m3: 0 });
    const again = (await consultant.get(`/api/briefings/${briefingId}/versions/1`)).body;
    expect(again.snapshot).toEqual(v1.snapshot);

    const v2 = await consultant.post(`/api/briefings/${briefingId}/publish`);
    expect(v2.body.version).toBe(2);
    const latest = (await consultant.get(`/api/briefings/${briefingId}/versions/latest`)).body;
    expect(latest.snapshot).toMatchObject({ version: 2, title: 'Renamed', sections: [] });
    expect(latest.snapshot.headlines[0].addedVolumeM3.value).not.toBe(v1.snapshot.headlines[0].addedVolumeM3.value);
    // Restore the draft for the tests below.
    await consultant.put(`/api/briefings/${briefingId}/draft`).send({ ...draft, sections: SECTIONS });
    await consultant.post(`/api/briefings/${briefingId}/publish`);
  });

  it('renders Markdown with script tags, handlers and javascript: links inert', async () => {
    const reading = (await consultant.get(`/api/briefings/${briefingId}/versions/latest`)).body;
    const html = reading.sectionHtml[2] as string;
    expect(html).toContain('Read with care.');
    expect(html).not.toMatch(/<script|onerror|javascript:|<img/i);
    expect(reading.summaryHtml).toContain('<strong>July</strong>');
  });
});

describe('client access', () => {
  it('hides a briefing not shared with the client (404, and not in the list)', async () => {
    expect((await client.get(`/api/briefings/${briefingId}/versions/latest`)).status).toBe(404);
    expect((await client.get(`/api/briefings/${briefingId}/versions/latest/pdf`)).status).toBe(404);
    expect((await client.get('/api/briefings')).body.briefings).toEqual([]);
  });

  it('lets a shared client read, comment and download, and nobody else', async () => {
    const shared = await consultant.post(`/api/briefings/${briefingId}/shares`).send({ emails: [org.users.client.email.toUpperCase()] });
    expect(shared.status).toBe(200);
    expect(shared.body.briefing.sharedWith.map((s: { email: string }) => s.email)).toEqual([org.users.client.email]);
    // The client is told by mail, with the link that opens the briefing.
    const mail = await catcher.waitFor((m) => m.to.includes(org.users.client.email) && /shared a briefing with you/.test(m.subject));
    expect(mail.text).toContain(`/briefings/${briefingId}`);

    const list = (await client.get('/api/briefings')).body.briefings;
    expect(list.map((b: { id: number }) => b.id)).toEqual([briefingId]);
    const reading = await client.get(`/api/briefings/${briefingId}/versions/latest`);
    expect(reading.status).toBe(200);
    expect(reading.body.snapshot.version).toBe(3);

    const sameOrg = await anotherClient(org.organisationId);
    expect((await sameOrg.agent.get(`/api/briefings/${briefingId}/versions/latest`)).status).toBe(404);
    const otherOrg = await signedInAgent(t.app, other.users.client.email);
    expect((await otherOrg.get(`/api/briefings/${briefingId}/versions/latest`)).status).toBe(404);
    expect((await otherOrg.get(`/api/briefings/${briefingId}/versions/latest/csv`)).status).toBe(404);
    const otherConsultant = await signedInAgent(t.app, other.users.consultant.email);
    expect((await otherConsultant.get(`/api/briefings/${briefingId}/draft`)).status).toBe(404);
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    expect((await scientist.get('/api/briefings')).status).toBe(403);

    const commented = await client.post(`/api/briefings/${briefingId}/comments`).send({ body: 'Does the July peak include rain?' });
    expect(commented.status).toBe(201);
    const seen = (await consultant.get(`/api/briefings/${briefingId}/comments`)).body.comments;
    expect(seen.at(-1)).toMatchObject({ body: 'Does the July peak include rain?', role: 'client', version: 3 });
    expect((await sameOrg.agent.post(`/api/briefings/${briefingId}/comments`).send({ body: 'hi' })).status).toBe(404);
  });

  it('keeps clients away from every write route', async () => {
    const draft = { title: 'Mine now', summary: '', selection: { runIds: [runId] }, sections: [] };
    const attempts = [
      client.post('/api/briefings').send({ catchmentId, title: 'Mine', selection: { runIds: [runId] } }),
      client.get(`/api/briefings/${briefingId}/draft`),
      client.put(`/api/briefings/${briefingId}/draft`).send(draft),
      client.get(`/api/briefings/${briefingId}/preview`),
      client.post(`/api/briefings/${briefingId}/publish`),
      client.post(`/api/briefings/${briefingId}/shares`).send({ emails: ['friend@test.example'] }),
      client.delete(`/api/briefings/${briefingId}/shares/${org.users.client.id}`),
      client.get(`/api/briefings/${briefingId}/audit`),
    ];
    for (const res of await Promise.all(attempts)) expect(res.status).toBe(403);
    expect((await consultant.get(`/api/briefings/${briefingId}/draft`)).body.briefing.title).not.toBe('Mine now');
  });

  it('tells the clients it is shared with by mail when a new version is published', async () => {
    const created = await consultant.post('/api/briefings').send({ catchmentId, title: 'Second look at the soot', selection: { runIds: [runId] } });
    const id = created.body.briefing.id;
    expect((await consultant.post(`/api/briefings/${id}/publish`)).status).toBe(201);
    expect((await consultant.post(`/api/briefings/${id}/shares`).send({ emails: [org.users.client.email] })).status).toBe(200);
    const published = await consultant.post(`/api/briefings/${id}/publish`);
    expect(published.body.version).toBe(2);
    const mail = await catcher.waitFor((m) => m.to.includes(org.users.client.email) && m.subject === 'New version of a briefing shared with you: Second look at the soot');
    expect(mail.text).toContain('published version 2 of the briefing "Second look at the soot"');
    expect(mail.text).toContain(`/briefings/${id}`);
  });

  it('invites a new address as a client at no seat cost and shares with them', async () => {
    const email = `${unique('newclient')}@test.example`;
    const res = await consultant.post(`/api/briefings/${briefingId}/shares`).send({ emails: [email] });
    expect(res.status).toBe(200);
    const user = await t.db('users').where({ email }).first();
    expect(user).toMatchObject({ role: 'client', status: 'invited', organisation_id: org.organisationId });
    expect(res.body.briefing.sharedWith.map((s: { email: string }) => s.email)).toContain(email);
    const mail = await catcher.waitFor((m) => m.to.includes(email));
    expect(mail.text).toMatch(/\/invitation\?token=/);
    const team = await consultant.post(`/api/briefings/${briefingId}/shares`).send({ emails: [org.users.scientist.email] });
    expect(team.status).toBe(422);
    expect(team.body.error.field).toBe('emails.0');
    const foreign = await consultant.post(`/api/briefings/${briefingId}/shares`).send({ emails: [other.users.client.email] });
    // Another organisation's address is left out without being named; its owner is told by mail.
    expect(foreign.status).toBe(200);
    expect(foreign.body.briefing.sharedWith.map((s: { email: string }) => s.email)).not.toContain(other.users.client.email);
    expect((await catcher.waitFor((m) => m.to.includes(other.users.client.email))).subject).toMatch(/could not be sent/);
  });
});

describe('downloads and audit', () => {
  it('gives the client a valid PDF with the headline numbers and the cautions', async () => {
    const res = await client.get(`/api/briefings/${briefingId}/versions/latest/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    const snapshot = (await client.get(`/api/briefings/${briefingId}/versions/latest`)).body.snapshot;
    const millions = (snapshot.headlines[0].addedVolumeM3.value / 1e6).toLocaleString('en-GB', { maximumFractionDigits: 2 });
    expect(text).toContain(`${millions} million m³`);
    expect(text).toContain('Soot 400 ng/g');
    for (const caution of CAUTIONS) expect(text).toContain(caution);
  });

  it('gives a CSV with the header block and escaped cells', async () => {
    const res = await client.get(`/api/briefings/${briefingId}/versions/latest/csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename=".*-v3\.csv"/);
    expect(res.text).toContain('Catchment,');
    expect(res.text).toContain('Version,3');
    expect(res.text).toMatch(/\r\nCalibration,.*Not calibrated/);
    expect(res.text).toMatch(/Input hash: Soot 400 ng\/g,[0-9a-f]+/);
    expect(res.text).toContain(CAUTIONS[0]);
  });

  it('logs who published, viewed and downloaded, for the consultant only', async () => {
    const events = (await consultant.get(`/api/briefings/${briefingId}/audit`)).body.events as { action: string; userEmail: string }[];
    const byClient = events.filter((e) => e.userEmail === org.users.client.email).map((e) => e.action);
    expect(byClient).toEqual(expect.arrayContaining(['viewed', 'downloaded-pdf', 'downloaded-csv', 'commented']));
    expect(events.filter((e) => e.action === 'published')).toHaveLength(3);
    expect(events.find((e) => e.action === 'published')!.userEmail).toBe(org.users.consultant.email);
  });
});
