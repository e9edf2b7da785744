import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { CSRF_COOKIE, SESSION_COOKIE } from '../../shared/contracts/auth';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
});
afterEach(() => t.close());

function cookieValue(setCookie: string[] | undefined, name: string): string | undefined {
  const line = setCookie?.find((c) => c.startsWith(`${name}=`));
  return line?.split(';')[0].slice(name.length + 1);
}

describe('sign-in', () => {
  it('returns the user and a token, and sets an httpOnly SameSite session cookie', async () => {
    const res = await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'Reviewer@Driftcase.example', password: 'driftcase-demo' })
      .expect(200);
    expect(res.body.user).toMatchObject({ email: 'reviewer@driftcase.example', role: 'reviewer' });
    expect(res.body.token.split('.')).toHaveLength(3);
    const cookies = res.headers['set-cookie'] as unknown as string[];
    const session = cookies.find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Strict/i);
    expect(res.body).not.toHaveProperty('user.passwordHash');
  });

  it('answers a wrong password and an unknown e-mail with the same generic message', async () => {
    const wrong = await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'legal@driftcase.example', password: 'nope' });
    const unknown = await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'who@driftcase.example', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('rate-limits repeated failures with 429 and keeps the JSON error shape', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++) {
      const res = await request(t.app)
        .post('/api/auth/login')
        .send({ email: 'admin@driftcase.example', password: `x${i}` });
      statuses.push(res.status);
      if (res.status === 429) expect(res.body.error.code).toBe('too_many_requests');
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
  });

  it('validates the body and names the field at fault', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'not-an-email' }).expect(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('accepts the bearer token and ends the session on logout', async () => {
    const token = await t.tokenFor('engineer');
    const me = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(200);
    expect(me.body.user.role).toBe('engineer');
    await request(t.app).post('/api/auth/logout').set('Authorization', `Bearer ${token}`).expect(204);
    await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(401);
  });

  it('needs the CSRF header for cookie-authenticated writes but not for bearer ones', async () => {
    const agent = request.agent(t.app);
    const login = await agent
      .post('/api/auth/login')
      .send({ email: 'investigator@driftcase.example', password: 'driftcase-demo' })
      .expect(200);
    const csrf = cookieValue(login.headers['set-cookie'] as unknown as string[], CSRF_COOKIE)!;
    const newCase = {
      title: 'CSRF probe',
      site: 'Test yard',
      robotId: 'R-1',
      incidentTime: '2026-11-01T10:00:00Z',
      severity: 'low',
    };
    const blocked = await agent.post('/api/cases').send(newCase);
    expect(blocked.status).toBe(403);
    expect(blocked.body.error.code).toBe('csrf_failed');
    await agent.post('/api/cases').set('X-CSRF-Token', 'forged').send(newCase).expect(403);
    await agent.post('/api/cases').set('X-CSRF-Token', csrf).send(newCase).expect(201);
    await agent.get('/api/cases').expect(200);
    const bearer = await t.tokenFor('investigator');
    await request(t.app)
      .post('/api/cases')
      .set('Authorization', `Bearer ${bearer}`)
      .send(newCase)
      .expect(201);
  });

  it('ends the sessions of a deactivated account', async () => {
    const engineerToken = await t.tokenFor('engineer');
    const adminToken = await t.tokenFor('admin');
    const list = await request(t.app)
      .get('/api/users')
      .set('Authorization', `Bearer ${adminToken}`)
      .expect(200);
    const engineer = list.body.items.find((u: { role: string }) => u.role === 'engineer');
    await request(t.app)
      .patch(`/api/users/${engineer.id}`)
      .set('Authorization', `Bearer ${adminToken}`)
      .send({ active: false })
      .expect(200);
    await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${engineerToken}`).expect(401);
    await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'engineer@driftcase.example', password: 'driftcase-demo' })
      .expect(401);
  });
});
