import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';
import { hashFile } from '../../../api/src/bundles/sha256-file';
import { RECORDING_PROGRESS_PHASES } from '../../../shared/contracts/recordings';
import { demoActor } from '../../support/case-members';
import { type CaseTestbed, createCaseTestbed } from '../../support/case-testbed';
import { createPerson } from '../../support/case-work-fixtures';
import { writeMcap } from '../../support/recordings/write-mcap';
import { replayToEnd } from '../../support/replay-runs';

/** The case page's recording upload, over HTTP; the MCAP comes from @mcap/core's own writer. */
const SAMPLE = path.resolve('sample-logs/wheel-slip');
let bed: CaseTestbed;
let mcap: string;
beforeAll(async () => {
  bed = await createCaseTestbed();
  mcap = await writeMcap(SAMPLE, path.join(bed.dir, 'plover.mcap'), { compression: 'zstd', scanLimit: 250 });
}, 240_000);
afterAll(() => bed.close());

const auth = () => ({ Authorization: `Bearer ${bed.token}` });

describe('POST /cases/:id/recordings', () => {
  it('stores the original, derives a valid bundle recording its SHA-256, and replays it', async () => {
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/recordings`)
      .set(auth())
      .field('incident', '21.5')
      .attach('recording', mcap);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.bundle.status).toBe('valid');
    const { sha256 } = await hashFile(mcap);
    // The original is in the evidence store under its own hash, unchanged.
    const storedPath = bed.t.app.locals.services.evidence.pathFor(sha256);
    expect(fs.readFileSync(storedPath).equals(fs.readFileSync(mcap))).toBe(true);
    // The derived bundle (kept as evidence too) names the original and its hash in its manifest.
    const derived = await bed.t.app.locals.services.bundles.originalFile(
      res.body.bundle.id,
      await demoActor(bed.t, 'investigator'),
    );
    const inspection = await inspectBundle({ kind: 'zip', path: derived.path });
    expect(inspection.bundle?.manifest.provenance?.sources[0]).toMatchObject({
      role: 'recording',
      name: 'plover.mcap',
      sha256,
    });
    expect(inspection.bundle?.events?.kind).toEqual(['incident']);
    const history = await bed.t.app.locals.services.audit.listCaseEntries(
      bed.caseId,
      { pageSize: 100 },
      await demoActor(bed.t, 'investigator'),
    );
    const entry = history.items.find((item: { action: string }) => item.action === 'bundle.upload');
    expect((entry?.details as { derivedFrom?: unknown[] } | undefined)?.derivedFrom?.[0]).toMatchObject({
      name: 'plover.mcap',
      sha256,
    });

    const replay = await replayToEnd(bed.t.app, bed.token, res.body.bundle.id);
    expect(replay.status).toBe('done');
  }, 240_000);

  it('keeps the originals and answers 422 naming the file for a file that is not a recording', async () => {
    const bogus = path.join(bed.dir, 'notes.mcap');
    fs.writeFileSync(bogus, 'this is not a recording');
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/recordings`)
      .set(auth())
      .attach('recording', bogus);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid_recording');
    expect(res.body.error.message).toContain('notes.mcap: not a recording Driftcase reads');
    const { sha256 } = await hashFile(bogus);
    expect(fs.existsSync(bed.t.app.locals.services.evidence.pathFor(sha256))).toBe(true);
  });

  it('refuses NUL in a text field with 400 naming it', async () => {
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/recordings`)
      .set(auth())
      .field('from', 'a\u0000b')
      .attach('recording', mcap);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('from');
  });

  it('reports how far the upload got to its uploader only, phase by phase, ending done', async () => {
    const progressId = '6f4b0f52-8d1e-4c55-9a3e-2f0c1d7e9b41';
    const progressPath = `/api/cases/${bed.caseId}/recordings/progress/${progressId}`;
    const seen: string[] = [];
    let uploading = true;
    const polling = (async () => {
      while (uploading) {
        const poll = await request(bed.t.app).get(progressPath).set(auth());
        if (poll.status === 200) seen.push(poll.body.phase);
      }
    })();
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/recordings`)
      .set(auth())
      .field('progress_id', progressId)
      .attach('recording', mcap);
    uploading = false;
    await polling;
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const after = await request(bed.t.app).get(progressPath).set(auth());
    expect(after.body).toEqual({ phase: 'done', fraction: 1 });
    // Phases only move forward (storing, reading, writing, checking, done).
    const order = seen.map((phase) => RECORDING_PROGRESS_PHASES.indexOf(phase as never));
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(seen).not.toContain('failed');
    // Polled back to back, the reading of 250 scans (many awaits on the file) is seen under way.
    expect(seen).toContain('reading');

    const password = 'second-investigator-pass-7Q';
    const second = await createPerson(bed.t, {
      email: 'wren.halloway@driftcase.example',
      name: 'Wren Halloway',
      role: 'investigator',
      password,
    });
    const login = await request(bed.t.app).post('/api/auth/login').send({ email: second.email, password });
    const other = login.body.token;
    // Not on the case: refused like any of its evidence; on the case: still not their upload.
    const outsider = await request(bed.t.app).get(progressPath).set('Authorization', `Bearer ${other}`);
    expect(outsider.status).toBe(403);
    await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/members`)
      .set(auth())
      .send({ userId: second.id })
      .expect(201);
    const colleague = await request(bed.t.app).get(progressPath).set('Authorization', `Bearer ${other}`);
    expect(colleague.status).toBe(404);
    const unknown = await request(bed.t.app)
      .get(`/api/cases/${bed.caseId}/recordings/progress/0d7c1f9e-3b2a-4e6f-8a1d-5c9b7e2f4a60`)
      .set(auth());
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toMatch(/No recording upload of yours/);
    const malformed = await request(bed.t.app)
      .get(`/api/cases/${bed.caseId}/recordings/progress/not-an-id`)
      .set(auth());
    expect(malformed.status).toBe(400);
  }, 120_000);
});
