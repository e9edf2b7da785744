import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let token: string;
beforeAll(async () => {
  t = await createTestApp();
  token = await t.tokenFor('investigator');
});
afterAll(() => t.close());

const auth = () => ({ Authorization: `Bearer ${token}` });
const newCase = (overrides: object = {}) => ({
  title: 'Robot stopped short of a pallet',
  site: 'Test yard',
  robotId: 'R-2',
  incidentTime: '2026-11-02T07:30:00+01:00',
  severity: 'medium',
  ...overrides,
});

describe('cases', () => {
  it('creates a case with a reference, the author and an RFC 3339 incident time', async () => {
    const res = await request(t.app).post('/api/cases').set(auth()).send(newCase()).expect(201);
    expect(res.body.reference).toMatch(/^DC-\d{4}$/);
    expect(res.body.status).toBe('open');
    expect(res.body.createdBy.name).toBe('Ines Okafor');
    // 07:30 at +01:00 is 06:30 UTC (RFC 3339 §4.2 offsets).
    expect(res.body.incidentTime).toBe('2026-11-02T06:30:00.000Z');
  });

  it('rejects a bad body with each faulty field path', async () => {
    const res = await request(t.app)
      .post('/api/cases')
      .set(auth())
      .send(newCase({ title: '', incidentTime: '2026-11-02 07:30', severity: 'huge' }))
      .expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    const paths = res.body.error.details.map((d: { path: string }) => d.path).sort();
    expect(paths).toEqual(['incidentTime', 'severity', 'title']);
  });

  it('pages, sorts and filters the list', async () => {
    for (const title of ['Alpha check', 'Bravo check', 'Charlie check']) {
      await request(t.app)
        .post('/api/cases')
        .set(auth())
        .send(newCase({ title, site: 'Paging depot' }))
        .expect(201);
    }
    const page1 = await request(t.app)
      .get('/api/cases?site=paging&sort=title&order=asc&pageSize=2&page=1')
      .set(auth())
      .expect(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.items.map((c: { title: string }) => c.title)).toEqual(['Alpha check', 'Bravo check']);
    const page2 = await request(t.app)
      .get('/api/cases?site=paging&sort=title&order=asc&pageSize=2&page=2')
      .set(auth())
      .expect(200);
    expect(page2.body.items.map((c: { title: string }) => c.title)).toEqual(['Charlie check']);
    const search = await request(t.app).get('/api/cases?q=bravo').set(auth()).expect(200);
    expect(search.body.items).toHaveLength(1);
    await request(t.app).get('/api/cases?pageSize=1000').set(auth()).expect(400);
  });

  it('treats % and _ in a search literally', async () => {
    const res = await request(t.app).get('/api/cases?q=%25').set(auth()).expect(200);
    expect(res.body.total).toBe(0);
  });

  it('gets and patches one case, and 404s an unknown id', async () => {
    const created = await request(t.app).post('/api/cases').set(auth()).send(newCase()).expect(201);
    const patched = await request(t.app)
      .patch(`/api/cases/${created.body.id}`)
      .set(auth())
      .send({ severity: 'high' })
      .expect(200);
    expect(patched.body.severity).toBe('high');
    const missing = await request(t.app)
      .get('/api/cases/00000000-0000-4000-8000-000000000000')
      .set(auth())
      .expect(404);
    expect(missing.body.error.code).toBe('not_found');
    const badId = await request(t.app).get('/api/cases/not-a-uuid').set(auth()).expect(400);
    expect(badId.body.error.details[0].path).toBe('id');
  });

  it('moves the status only through the lifecycle: an illegal jump is a 409', async () => {
    const created = await request(t.app).post('/api/cases').set(auth()).send(newCase()).expect(201);
    const jump = await request(t.app)
      .patch(`/api/cases/${created.body.id}`)
      .set(auth())
      .send({ status: 'signed_off', severity: 'low' })
      .expect(409);
    expect(jump.body.error.code).toBe('illegal_transition');
    const unchanged = await request(t.app).get(`/api/cases/${created.body.id}`).set(auth()).expect(200);
    expect(unchanged.body).toMatchObject({ status: 'open', severity: 'medium' });
    const moved = await request(t.app)
      .patch(`/api/cases/${created.body.id}`)
      .set(auth())
      .send({ status: 'analysing' })
      .expect(200);
    expect(moved.body.status).toBe('analysing');
  });

  it('answers unknown API routes and malformed JSON with JSON errors', async () => {
    const unknown = await request(t.app).get('/api/nothing-here').set(auth()).expect(404);
    expect(unknown.body.error.code).toBe('not_found');
    const malformed = await request(t.app)
      .post('/api/cases')
      .set(auth())
      .set('Content-Type', 'application/json')
      .send('{"title": ')
      .expect(400);
    expect(malformed.body.error.message).toMatch(/not valid JSON/);
  });
  it('gives each case its path: where it stands, who holds it and since when', async () => {
    const created = await request(t.app).post('/api/cases').set(auth()).send(newCase()).expect(201);
    // A new case has no evidence: the first stage is the one being worked towards, by an investigator.
    expect(created.body.path.standing).toBeNull();
    expect(created.body.path.summary).toBe('Waiting for evidence');
    expect(created.body.path.holders).toEqual(['investigator']);
    expect(created.body.path.since).toBe(created.body.createdAt);
    expect(created.body.path.stages.map((s: { state: string }) => s.state)).toEqual([
      'now',
      'todo',
      'todo',
      'todo',
      'todo',
      'todo',
    ]);
    // A status change through PATCH is a move on the path: "since" follows its audit entry.
    const moved = await request(t.app)
      .patch(`/api/cases/${created.body.id}`)
      .set(auth())
      .send({ status: 'analysing' })
      .expect(200);
    expect(Date.parse(moved.body.path.since)).toBeGreaterThan(Date.parse(created.body.createdAt));
    const listed = await request(t.app)
      .get('/api/cases')
      .query({ q: created.body.reference })
      .set(auth())
      .expect(200);
    expect(listed.body.items[0].path).toEqual(moved.body.path);
  });
});
