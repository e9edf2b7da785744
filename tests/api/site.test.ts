import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../api/src/config';
import { createTestApp, type TestApp } from '../support/test-app';

const apps: TestApp[] = [];
afterAll(() => Promise.all(apps.map((app) => app.close())));

describe('site settings', () => {
  it('tells anyone, signed in or not, the zone times are shown in', async () => {
    const t = await createTestApp({ SITE_TIME_ZONE: 'Europe/Berlin' });
    apps.push(t);
    const res = await request(t.app).get('/api/site').expect(200);
    expect(res.body).toEqual({ timeZone: 'Europe/Berlin' });
  });

  it('defaults to UTC and refuses a zone that does not exist, naming the variable', () => {
    expect(loadConfig({}).siteTimeZone).toBe('UTC');
    expect(() => loadConfig({ SITE_TIME_ZONE: 'Europe/Atlantis' })).toThrow(
      /SITE_TIME_ZONE: .*IANA time zone/,
    );
  });
});
