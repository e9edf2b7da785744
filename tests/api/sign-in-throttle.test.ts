import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../api/src/seed/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Sign-in throttling per account (across addresses) and per address (across accounts), as the
 * OWASP Authentication Cheat Sheet ("Login Throttling") asks; the test app trusts X-Forwarded-For
 * from loopback like a reverse proxy in front of it. Addresses are from the documentation ranges
 * of RFC 5737 (198.51.100.0/24, 203.0.113.0/24).
 */
let t: TestApp;
// Generous: the first app migrates the template database, slow on a loaded machine.
beforeEach(async () => {
  t = await createTestApp();
}, 180_000);
afterEach(() => t.close());

const signIn = (email: string, password: string, address: string) =>
  request(t.app).post('/api/auth/login').set('X-Forwarded-For', address).send({ email, password });

describe('sign-in throttling', () => {
  it('locks an account after repeated wrong passwords from twenty different addresses', async () => {
    const statuses: number[] = [];
    for (let i = 1; i <= 20; i++) {
      const res = await signIn('investigator@driftcase.example', `wrong-${i}`, `198.51.100.${i}`);
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses.slice(10)).toEqual(Array(10).fill(429));

    // Even the right password from yet another address waits out the lock, and is told how long.
    const locked = await signIn('investigator@driftcase.example', DEMO_PASSWORD, '198.51.100.77');
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe('too_many_requests');
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(0);
    // Other accounts are not affected.
    await signIn('reviewer@driftcase.example', DEMO_PASSWORD, '198.51.100.1').expect(200);
  }, 300_000);

  it('locks an address that tries two hundred different e-mails', async () => {
    const statuses: number[] = [];
    for (let i = 1; i <= 200; i++) {
      const res = await signIn(`guess-${i}@driftcase.example`, 'not-the-password', '203.0.113.9');
      statuses.push(res.status);
    }
    expect(statuses).toContain(429);
    const firstRefused = statuses.indexOf(429);
    expect(statuses.slice(0, firstRefused).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(firstRefused).every((s) => s === 429)).toBe(true);
    // A real account from that address is refused too; from another address it signs in.
    await signIn('legal@driftcase.example', DEMO_PASSWORD, '203.0.113.9').expect(429);
    await signIn('legal@driftcase.example', DEMO_PASSWORD, '203.0.113.10').expect(200);
  }, 300_000);

  it('computes at most two password hashes at once under a burst of sign-ins', async () => {
    const hashing = t.app.locals.services.passwordHashing;
    const burst = Array.from({ length: 24 }, (_, i) =>
      signIn(`burst-${i}@driftcase.example`, 'not-the-password', `198.51.100.${100 + i}`),
    );
    // Signed-in users are answered while the burst is hashed.
    const token = await t.tokenFor('engineer');
    const during = request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
    const [me, ...attempts] = await Promise.all([during, ...burst]);
    expect(me.status).toBe(200);
    expect(attempts.map((res) => res.status)).toEqual(Array(24).fill(401));
    expect(hashing.stats().peakRunning).toBeGreaterThan(0);
    expect(hashing.stats().peakRunning).toBeLessThanOrEqual(2);
    expect(hashing.stats()).toMatchObject({ running: 0, waiting: 0 });
  }, 300_000);
});
