import { describe, expect, it } from 'vitest';
import { sortRecordingFiles } from '../../../../web/src/features/bundles/lib/sort-recording-files';

/**
 * Files dropped together are sorted onto the recording upload's fields. A map_server map
 * description is told from a parameter file by its `image:` key, which the map_server YAML
 * format requires (ROS map_server documentation, "YAML format"); parameter files carry none.
 */
const file = (name: string, text = '') => new File([text], name);

describe('sortRecordingFiles', () => {
  it('puts each file on its field by extension, and a YAML by what it holds', async () => {
    const mapYaml = 'image: aisle-7.pgm\nresolution: 0.05\norigin: [0.0, 0.0, 0.0]\nnegate: 0\n';
    const paramsYaml = 'amcl:\n  ros__parameters:\n    max_particles: 2000\n';
    const sorted = await sortRecordingFiles([
      file('heron.mcap'),
      file('aisle-7.yaml', mapYaml),
      file('aisle-7.pgm'),
      file('amcl.yaml', paramsYaml),
      file('heron.json', '{}'),
    ]);
    expect(Object.fromEntries(Object.entries(sorted.files).map(([role, f]) => [role, f?.name]))).toEqual({
      recording: 'heron.mcap',
      map: 'aisle-7.yaml',
      map_image: 'aisle-7.pgm',
      params: 'amcl.yaml',
      robot: 'heron.json',
    });
    expect(sorted.unrecognised).toEqual([]);
  });

  it('names files that fit no field, and a second file of a kind, instead of sending them', async () => {
    const sorted = await sortRecordingFiles([file('older.BAG'), file('notes.txt'), file('newer.bag')]);
    expect(sorted.files.recording?.name).toBe('older.BAG');
    expect(sorted.unrecognised).toEqual(['notes.txt', 'newer.bag']);
  });
});
