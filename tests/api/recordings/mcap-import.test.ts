import { copyFileSync, mkdtempSync, readFileSync, rmSync, statSync, truncateSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { McapIndexedReader } from '@mcap/core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBundleSourceFiles } from '../../../api/src/bundles/read-bundle-files';
import { importRecording } from '../../../api/src/recordings/import-recording';
import { RecordingError } from '../../../api/src/recordings/recording-error';
import { analyseReplay } from '../../../api/src/replays/analyse-replay';
import { replayFromFiles } from '../../../shared/engine';
import { writeMcap } from '../../support/recordings/write-mcap';
import { importedBundle } from './imported-bundle';

/**
 * MCAP recordings written with the MCAP library's own writer (@mcap/core McapWriter, zstd chunks
 * from @foxglove/wasm-zstd) and CDR bytes laid out by hand with @foxglove/cdr's CdrWriter in the
 * ROS 2 field order: not the importer's decoder. Expected values are the sample bundle's files.
 */
const SAMPLE = path.resolve('sample-logs/wheel-slip');
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'dc-mcap-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const typed = importedBundle;

describe('MCAP import', () => {
  it('reads an indexed zstd MCAP into the written values and replays like the bundle written directly', async () => {
    const source = await writeMcap(SAMPLE, path.join(dir, 'ws.mcap'), {
      compression: 'zstd',
      omitCommandSchema: true,
    });
    const out = path.join(dir, 'ws.zip');
    const summary = await importRecording({ source, out });
    expect(summary.format).toBe('mcap');
    expect(summary.breakNote).toBeUndefined();
    const imported = await typed({ kind: 'zip', path: out });
    const written = await typed({ kind: 'folder', path: SAMPLE });
    expect(imported.odometry.t.length).toBe(written.odometry.t.length);
    expect(imported.odometry.y[300]).toBeCloseTo(written.odometry.y[300], 12);
    expect(imported.odometry.t[300]).toBeCloseTo(written.odometry.t[300], 9);
    expect(imported.scans?.count).toBe(written.scans?.count);
    // float32 ranges (sensor_msgs/LaserScan): 7 significant digits survive.
    expect(imported.scans?.ranges[4321]).toBeCloseTo(written.scans?.ranges[4321] ?? -1, 5);
    expect(Array.from(imported.map.grid?.cells ?? [])).toEqual(Array.from(written.map.grid?.cells ?? []));
    // /cmd_vel had no schema in the file: decoded from the built-in geometry_msgs/Twist.
    expect(imported.commands?.omega[42]).toBeCloseTo(written.commands?.omega[42] ?? -1, 12);

    const overrides = {
      seed: 211,
      particles: 1000,
      motion_alpha: [0.05, 0.005, 0.01, 0.002],
      resampling_method: 'systematic',
      resampling_threshold: 0.5,
    };
    const replayOf = async (bundle: { kind: 'zip' | 'folder'; path: string }) => {
      const read = await readBundleSourceFiles(bundle);
      if (!read.ok) throw new Error('unreadable');
      const result = replayFromFiles(read.files, overrides);
      return {
        rmse: result.metrics.rmse_onboard,
        flags: analyseReplay(result.bundle, result, result.context).flags,
      };
    };
    const direct = await replayOf({ kind: 'folder', path: SAMPLE });
    const fromMcap = await replayOf({ kind: 'zip', path: out });
    // Same RMSE within 0.01 m and the wheel slip (18-22 s, sample-logs/catalog.json) flagged.
    expect(Math.abs((fromMcap.rmse ?? 99) - (direct.rmse ?? -99))).toBeLessThan(0.01);
    const slip = (flags: { kind: string; start: number; end: number }[]) =>
      flags.some((f) => f.kind === 'odometry_disagrees_with_scans' && f.start <= 21 && f.end >= 18);
    expect(slip(direct.flags)).toBe(true);
    expect(slip(fromMcap.flags)).toBe(true);
  }, 240_000);

  it('reads lz4-compressed chunks (lz4 frames from lz4js) into the same values', async () => {
    const source = await writeMcap(SAMPLE, path.join(dir, 'ws-lz4.mcap'), { compression: 'lz4' });
    const chunkCompressions = new Set<string>();
    const bytes = readFileSync(source);
    const reader = await McapIndexedReader.Initialize({
      readable: {
        size: async () => BigInt(bytes.length),
        read: async (offset, length) => bytes.subarray(Number(offset), Number(offset + length)),
      },
    });
    for (const chunk of reader.chunkIndexes) chunkCompressions.add(chunk.compression);
    expect([...chunkCompressions]).toEqual(['lz4']);
    const out = path.join(dir, 'ws-lz4.zip');
    await importRecording({ source, out });
    const imported = await typed({ kind: 'zip', path: out });
    const written = await typed({ kind: 'folder', path: SAMPLE });
    expect(imported.odometry.t.length).toBe(written.odometry.t.length);
    expect(imported.odometry.x[150]).toBeCloseTo(written.odometry.x[150], 12);
    expect(imported.scans?.count).toBe(written.scans?.count);
    // Every 97th beam, NaN (no return) included: float32 keeps 7 significant digits.
    const sampled = (ranges: Float64Array | Float32Array | undefined) =>
      Array.from(ranges ?? [], (r) => Math.round(r * 1e4) / 1e4).filter((_, i) => i % 97 === 0);
    expect(sampled(imported.scans?.ranges)).toEqual(sampled(written.scans?.ranges));
  }, 120_000);

  it('imports what a file cut at 60 % holds and says where it broke', async () => {
    const whole = await writeMcap(SAMPLE, path.join(dir, 'whole.mcap'), {
      compression: 'zstd',
      scanLimit: 300,
    });
    const cut = path.join(dir, 'cut.mcap');
    copyFileSync(whole, cut);
    const size = statSync(whole).size;
    truncateSync(cut, Math.floor(size * 0.6));
    const before = readFileSync(cut);
    const summary = await importRecording({ source: cut, out: path.join(dir, 'cut.zip') });
    expect(summary.breakNote).toMatch(/cut\.mcap: reading stopped at byte \d+ of \d+: .*cut short/);
    expect(summary.warnings.some((line) => line.includes('reading stopped at byte'))).toBe(true);
    const imported = await typed({ kind: 'zip', path: path.join(dir, 'cut.zip') });
    expect(imported.scans?.count).toBeGreaterThan(0);
    expect(imported.scans?.count).toBeLessThan(300);
    // The original is read, never written.
    expect(readFileSync(cut).equals(before)).toBe(true);
  }, 120_000);

  it('names the topic and message time when the scan geometry changes', async () => {
    const source = await writeMcap(SAMPLE, path.join(dir, 'short.mcap'), {
      compression: 'none',
      scanLimit: 40,
      shortScanAt: 25,
    });
    const error = await importRecording({ source, out: path.join(dir, 'short.zip') }).catch((e) => e);
    expect(error).toBeInstanceOf(RecordingError);
    // Scan 25 is at t = 2.5 s after 2026-11-16T13:47:30Z (sample-logs/wheel-slip/scans.ndjson).
    expect(error.message).toMatch(
      /^short\.mcap: topic \/scan: message time 1794836852\.5\d* s: .*beam count 271 -> 270/,
    );
  }, 60_000);

  it('refuses a file that is not a recording with its name', async () => {
    const error = await importRecording({
      source: path.join(SAMPLE, 'map.json'),
      out: path.join(dir, 'x.zip'),
    }).catch((e) => e);
    expect(error).toBeInstanceOf(RecordingError);
    expect(error.message).toMatch(/^map\.json: not a recording Driftcase reads/);
  });
});
