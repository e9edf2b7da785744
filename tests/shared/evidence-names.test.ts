import { describe, expect, it } from 'vitest';
import { nameEvidence, toEvidenceNames } from '../../shared/evidence-names';

// Invented case items; the expected wording is written out by hand from the rule in
// shared/evidence-names.ts (name first, then what identifies it, the full hash kept).
const BUNDLE = '7d3c1f0e-2b4a-4c8e-9f10-aa0000000001';
const REPLAY = '96b69dea-0c1d-4e2f-8a3b-bb0000000002';
const BOOKMARK = '1f2e3d4c-5b6a-4978-8a9b-cc0000000003';
const QUERY = 'a1b2c3d4-e5f6-4a7b-8c9d-dd0000000004';
const FIGURE = 'e1f2a3b4-c5d6-4e7f-8a9b-ee0000000005';
const FIGURE_SHA = 'ab12cd34'.repeat(8);
const DIGEST = 'c0ffee00'.repeat(8);
const names = toEvidenceNames({
  bundles: [{ id: BUNDLE, originalName: 'hl07-dock4.zip' }],
  replays: [{ id: REPLAY, label: 'Wider motion noise', bundleId: BUNDLE }],
  bookmarks: [
    {
      id: BOOKMARK,
      note: 'Belief splits at the rack corner',
      t: 55.767,
      replayId: REPLAY,
      replayLabel: 'Wider motion noise',
      bundleId: BUNDLE,
    },
  ],
  queries: [{ id: QUERY, title: 'Protective stops per minute', bundleId: BUNDLE }],
  figures: [
    {
      id: FIGURE,
      caption: 'Map · Wider motion noise · digest c0ffee00c0ff… · step 42 · 4.20 s',
      fileName: 'figure-ab12cd34ab12.png',
      sha256: FIGURE_SHA,
    },
  ],
});

describe('cited evidence by name', () => {
  it('names a replay by its label, its bundle and a short digest, and opens it', () => {
    const named = nameEvidence({ type: 'replay', replayId: REPLAY, digest: DIGEST }, names);
    expect(named.name).toBe('Wider motion noise');
    expect(named.detail).toBe('replay of hl07-dock4.zip, digest c0ffee00c0ff…');
    expect(named.hash).toEqual({ label: 'digest', value: DIGEST });
    expect(named.target).toEqual({ bundleId: BUNDLE, replayId: REPLAY });
  });

  it('names a bookmark by its note and moment, and opens the replay at that moment', () => {
    const named = nameEvidence({ type: 'bookmark', bookmarkId: BOOKMARK }, names);
    expect(named.name).toBe('Belief splits at the rack corner');
    expect(named.detail).toBe('at 55.8 s in replay Wider motion noise');
    expect(named.target).toEqual({ bundleId: BUNDLE, replayId: REPLAY, t: 55.767 });
  });

  it('names a saved query by its title and a bundle file by its name and bundle', () => {
    const query = nameEvidence({ type: 'saved_query', queryId: QUERY, resultSha256: 'ab'.repeat(32) }, names);
    expect(query.name).toBe('Protective stops per minute');
    expect(query.target).toEqual({ bundleId: BUNDLE, isQuery: true });
    const file = nameEvidence(
      { type: 'bundle_file', bundleId: BUNDLE, file: 'scans.ndjson', sha256: '12'.repeat(32) },
      names,
    );
    expect(file.name).toBe('scans.ndjson');
    expect(file.detail).toBe('in hl07-dock4.zip, SHA-256 121212121212…');
  });

  it('names a cited probable cause by its kind and its replay, and opens that replay', () => {
    const named = nameEvidence(
      { type: 'cause', replayId: REPLAY, digest: DIGEST, kind: 'odometry_fault' },
      names,
    );
    expect(named.name).toBe('Odometry fault');
    expect(named.detail).toBe('probable cause in replay Wider motion noise, digest c0ffee00c0ff…');
    expect(named.target).toEqual({ bundleId: BUNDLE, replayId: REPLAY });
  });

  it('says plainly when a cited item is not in the case, keeping its id and hash', () => {
    const other = '00000000-0000-4000-8000-000000000009';
    const named = nameEvidence({ type: 'replay', replayId: other, digest: DIGEST }, names);
    expect(named.isFound).toBe(false);
    expect(named.name).toBe('Replay 00000000');
    expect(named.detail).toBe('digest c0ffee00c0ff…, not found in this case');
    expect(named.hash?.value).toBe(DIGEST);
    expect(named.target).toBeNull();
  });

  it('names a figure by its caption, with its file and short SHA-256, and points at its picture', () => {
    const named = nameEvidence({ type: 'figure', figureId: FIGURE, sha256: FIGURE_SHA }, names);
    expect(named).toEqual({
      name: 'Map · Wider motion noise · digest c0ffee00c0ff… · step 42 · 4.20 s',
      detail: 'picture figure-ab12cd34ab12.png, SHA-256 ab12cd34ab12…',
      hash: { label: 'SHA-256', value: FIGURE_SHA },
      isFound: true,
      target: null,
      picture: { figureId: FIGURE, fileName: 'figure-ab12cd34ab12.png' },
    });
    const unknown = nameEvidence({ type: 'figure', figureId: BOOKMARK, sha256: FIGURE_SHA }, names);
    expect(unknown.isFound).toBe(false);
    expect(unknown.detail).toBe('SHA-256 ab12cd34ab12…, not found in this case');
  });
});
