import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';
import { makeBundleFiles, makeTempDir, writeBundleZip } from '../../support/bundle-fixtures';

describe('a bundle with one enormous line', () => {
  it('refuses a 60-million-character line in odometry.csv, naming the file and the line', async () => {
    const files = makeBundleFiles({ steps: 20 });
    const [header, first] = files['odometry.csv'].split('\n');
    // Line 3 is one number of 60 million digits: no line ending for 60 MB.
    const odometry = `${header}\n${first}\n${'7'.repeat(60_000_000)}\n`;
    const zip = await writeBundleZip(join(await makeTempDir(), 'long-line.zip'), {
      ...files,
      'odometry.csv': odometry,
    });
    const inspection = await inspectBundle({ kind: 'zip', path: zip });
    expect(inspection.ok).toBe(false);
    expect(inspection.issues).toContainEqual(
      expect.objectContaining({
        file: 'odometry.csv',
        line: 3,
        message: expect.stringMatching(/line 3 is longer than 1,000,000 characters/),
      }),
    );
  }, 120_000);
});
