import { describe, expect, it } from 'vitest';
import {
  mapFromImage,
  mapFromOccupancyGrid,
  parsePgm,
  readMapYaml,
} from '../../../shared/recording/map-server-map';

/**
 * map_server conventions, from the ROS map_server documentation (wiki.ros.org/map_server, "Map
 * format" and "Value interpretation"): with negate 0 a pixel x gives p = (255 - x) / 255; p >
 * occupied_thresh is occupied, p < free_thresh is free, anything else unknown; with negate 1,
 * p = x / 255. Image row 0 is the top (north) of the map; origin is the lower-left pixel's pose.
 */
const pgm = (width: number, height: number, pixels: number[]) =>
  new Uint8Array([...new TextEncoder().encode(`P5\n# hand-made\n${width} ${height}\n255\n`), ...pixels]);

// 4 x 3 image, values chosen on both sides of each threshold (p computed by hand):
//   0 -> p 1.000 occupied     254 -> p 0.004 free       205 -> p 0.1961 > 0.196 unknown
//   206 -> p 0.1922 free       89 -> p 0.651 occupied     90 -> p 0.647 unknown
const PIXELS = [0, 254, 205, 206, 89, 90, 254, 254, 0, 0, 128, 255];
const YAML = {
  image: 'm.pgm',
  resolution: 0.05,
  origin: [-1.5, 2.0, 0],
  negate: 0,
  occupied_thresh: 0.65,
  free_thresh: 0.196,
};

describe('map_server YAML + PGM', () => {
  it('gives exactly the expected trinary grid, north row first', () => {
    const map = mapFromImage(readMapYaml(YAML, 'm.yaml'), parsePgm(pgm(4, 3, PIXELS), 'm.pgm'));
    // 128 -> p 0.498 unknown; 255 -> p 0 free.
    expect(map.rows).toEqual(['#.?.', '#?..', '##?.']);
    expect(map).toMatchObject({ width: 4, height: 3, resolution: 0.05, origin: [-1.5, 2.0] });
  });

  it('reads negate 1 as p = x / 255', () => {
    const map = mapFromImage(
      readMapYaml({ ...YAML, negate: 1 }, 'm.yaml'),
      parsePgm(pgm(4, 3, PIXELS), 'm.pgm'),
    );
    // 0 -> p 0 free; 254 -> 0.996 occupied; 205 -> 0.804 occupied; 89 -> 0.349 unknown; 128 -> 0.502 unknown.
    expect(map.rows).toEqual(['.###', '??##', '..?#']);
  });

  it('reads a plain (P2) PGM the same as a binary one', () => {
    const plain = new TextEncoder().encode(`P2\n4 3\n255\n${PIXELS.join(' ')}\n`);
    expect(mapFromImage(readMapYaml(YAML, 'm.yaml'), parsePgm(plain, 'm.pgm')).rows).toEqual([
      '#.?.',
      '#?..',
      '##?.',
    ]);
  });

  it('refuses a rotated origin, bad thresholds and a short image with the file and field', () => {
    expect(() => readMapYaml({ ...YAML, origin: [0, 0, 0.3] }, 'm.yaml')).toThrow(
      /^m\.yaml: origin: the map is rotated \(yaw 0\.3 rad\)/,
    );
    expect(() => readMapYaml({ ...YAML, free_thresh: 0.7 }, 'm.yaml')).toThrow(/^m\.yaml: free_thresh:/);
    expect(() => parsePgm(pgm(4, 3, PIXELS.slice(0, 10)), 'm.pgm')).toThrow(
      /^m\.pgm: image data is short: expected 12 bytes, found 10/,
    );
    expect(() => parsePgm(new TextEncoder().encode('P6 4 3 255 '), 'm.pgm')).toThrow(/not a PGM image/);
  });
});

describe('nav_msgs/OccupancyGrid', () => {
  it('flips the south-first data rows into map.json order', () => {
    // nav_msgs/OccupancyGrid: row-major from cell (0, 0) at the origin, so data[0..3] is the SOUTH row.
    const message = {
      info: {
        resolution: 0.1,
        width: 3,
        height: 2,
        origin: { position: { x: 1, y: 2 }, orientation: { x: 0, y: 0, z: 0, w: 1 } },
      },
      data: [100, 0, -1, 0, 0, 100],
    };
    expect(mapFromOccupancyGrid(message, 0).rows).toEqual(['..#', '#.?']);
    expect(() => mapFromOccupancyGrid(message, 0.5)).toThrow(/rotated/);
  });
});
