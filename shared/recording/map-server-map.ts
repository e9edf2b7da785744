/**
 * map_server maps (a YAML description plus a PGM image) and nav_msgs/OccupancyGrid messages,
 * turned into Driftcase's map.json. Conventions from the ROS map_server documentation
 * (wiki.ros.org/map_server, "Map format") and nav_msgs/OccupancyGrid's definition.
 */

export interface MapJson {
  resolution: number;
  origin: [number, number];
  width: number;
  height: number;
  rows: string[];
}

export interface MapYaml {
  image: string;
  resolution: number;
  origin: [number, number, number];
  negate: 0 | 1;
  occupied_thresh: number;
  free_thresh: number;
  mode: 'trinary' | 'scale' | 'raw';
}

export class MapInputError extends Error {}

/** Checks a parsed map YAML; map_server's defaults apply where it allows them (mode trinary). */
export function readMapYaml(value: unknown, file: string): MapYaml {
  const fail = (field: string, message: string): never => {
    throw new MapInputError(`${file}: ${field}: ${message}`);
  };
  if (!value || typeof value !== 'object') fail('(document)', 'expected a YAML mapping');
  const map = value as Record<string, unknown>;
  const number = (field: string) => {
    const found = map[field];
    if (typeof found !== 'number' || !Number.isFinite(found))
      fail(field, `expected a number, found ${JSON.stringify(found)}`);
    return found as number;
  };
  if (typeof map.image !== 'string' || map.image === '') fail('image', 'expected the image file name');
  const resolution = number('resolution');
  if (resolution <= 0) fail('resolution', `expected > 0 m per cell, found ${resolution}`);
  const origin = map.origin;
  if (
    !Array.isArray(origin) ||
    origin.length !== 3 ||
    !origin.every((v) => typeof v === 'number' && Number.isFinite(v))
  ) {
    fail('origin', `expected [x, y, yaw], found ${JSON.stringify(origin)}`);
  }
  const [ox, oy, yaw] = origin as [number, number, number];
  if (yaw !== 0) {
    fail(
      'origin',
      `the map is rotated (yaw ${yaw} rad); Driftcase maps are axis-aligned: re-save the map with yaw 0 (rotate the image) and import again`,
    );
  }
  const negate = map.negate ?? 0;
  if (negate !== 0 && negate !== 1) fail('negate', `expected 0 or 1, found ${JSON.stringify(negate)}`);
  const occupied = number('occupied_thresh');
  const free = number('free_thresh');
  if (!(free >= 0 && free < occupied && occupied <= 1)) {
    fail('free_thresh', `expected 0 <= free_thresh < occupied_thresh <= 1, found ${free} and ${occupied}`);
  }
  const mode = map.mode ?? 'trinary';
  if (mode !== 'trinary' && mode !== 'scale' && mode !== 'raw')
    fail('mode', `expected trinary, scale or raw, found ${JSON.stringify(mode)}`);
  return {
    image: map.image as string,
    resolution,
    origin: [ox, oy, 0],
    negate: negate as 0 | 1,
    occupied_thresh: occupied,
    free_thresh: free,
    mode: mode as MapYaml['mode'],
  };
}

export interface GreyImage {
  width: number;
  height: number;
  maxValue: number;
  /** Row-major, row 0 the top of the image. */
  pixels: Uint8Array | Uint16Array;
}

/** Netpbm PGM, binary (P5) or plain (P2), as map_server saves and reads. */
export function parsePgm(bytes: Uint8Array, file: string): GreyImage {
  let offset = 0;
  const fail = (message: string): never => {
    throw new MapInputError(`${file}: ${message}`);
  };
  const nextToken = (): string => {
    for (;;) {
      while (offset < bytes.length && /\s/.test(String.fromCharCode(bytes[offset]))) offset++;
      if (bytes[offset] === 0x23) {
        while (offset < bytes.length && bytes[offset] !== 0x0a) offset++;
        continue;
      }
      break;
    }
    const start = offset;
    while (offset < bytes.length && !/\s/.test(String.fromCharCode(bytes[offset]))) offset++;
    return String.fromCharCode(...bytes.subarray(start, offset));
  };
  const magic = nextToken();
  if (magic !== 'P5' && magic !== 'P2')
    fail(`not a PGM image (expected P5 or P2 at the start, found "${magic.slice(0, 8)}")`);
  const width = Number(nextToken());
  const height = Number(nextToken());
  const maxValue = Number(nextToken());
  if (!Number.isInteger(width) || width <= 0 || !Number.isInteger(height) || height <= 0)
    fail('bad image size in the header');
  if (!Number.isInteger(maxValue) || maxValue <= 0 || maxValue > 65535)
    fail('bad maximum grey value in the header');
  const count = width * height;
  const pixels = maxValue > 255 ? new Uint16Array(count) : new Uint8Array(count);
  if (magic === 'P5') {
    offset++; // exactly one whitespace byte after the header
    const size = maxValue > 255 ? 2 : 1;
    if (bytes.length - offset < count * size)
      fail(`image data is short: expected ${count * size} bytes, found ${bytes.length - offset}`);
    for (let i = 0; i < count; i++) {
      pixels[i] = size === 1 ? bytes[offset + i] : (bytes[offset + 2 * i] << 8) | bytes[offset + 2 * i + 1];
    }
  } else {
    for (let i = 0; i < count; i++) {
      const token = nextToken();
      if (token === '') fail(`image data is short: expected ${count} values, found ${i}`);
      pixels[i] = Number(token);
    }
  }
  return { width, height, maxValue, pixels };
}

/**
 * map_server's rule: with negate 0, p = (255 - value) / 255 (dark = occupied); with negate 1,
 * p = value / 255. trinary and scale: p > occupied_thresh is occupied, p < free_thresh is free,
 * otherwise unknown (scale's in-between probabilities have no place in a three-state grid, so
 * they become unknown). raw: the value is the occupancy 0..100 itself, thresholds times 100.
 * Image row 0 is the north edge, as in map.json, so rows keep their order.
 */
export function mapFromImage(yaml: MapYaml, image: GreyImage): MapJson {
  const rows: string[] = [];
  for (let i = 0; i < image.height; i++) {
    let row = '';
    for (let j = 0; j < image.width; j++) {
      const value = image.pixels[i * image.width + j] * (255 / image.maxValue);
      if (yaml.mode === 'raw') {
        row += classifyOccupancy(value, yaml);
        continue;
      }
      const p = yaml.negate ? value / 255 : (255 - value) / 255;
      row += p > yaml.occupied_thresh ? '#' : p < yaml.free_thresh ? '.' : '?';
    }
    rows.push(row);
  }
  return {
    resolution: yaml.resolution,
    origin: [yaml.origin[0], yaml.origin[1]],
    width: image.width,
    height: image.height,
    rows,
  };
}

function classifyOccupancy(
  value: number,
  thresholds: { occupied_thresh: number; free_thresh: number },
): string {
  if (value < 0 || value > 100) return '?';
  if (value > thresholds.occupied_thresh * 100) return '#';
  if (value < thresholds.free_thresh * 100) return '.';
  return '?';
}

export interface OccupancyGridMessage {
  info: {
    resolution: number;
    width: number;
    height: number;
    origin: {
      position: { x: number; y: number };
      orientation: { x: number; y: number; z: number; w: number };
    };
  };
  data: ArrayLike<number>;
}

/**
 * nav_msgs/OccupancyGrid: `data` is row-major starting at the origin cell (0, 0), i.e. the SOUTH
 * row first, values 0..100 or -1 unknown; map.json wants the north row first, so rows are flipped.
 * Values are classified with map_server's default thresholds scaled to 0..100 (65 and 19.6).
 */
export function mapFromOccupancyGrid(message: OccupancyGridMessage, yaw: number): MapJson {
  const { width, height, resolution, origin } = message.info;
  if (Math.abs(yaw) > 1e-9) {
    throw new MapInputError(`the map's origin is rotated (yaw ${yaw} rad); Driftcase maps are axis-aligned`);
  }
  if (message.data.length !== width * height) {
    throw new MapInputError(
      `data has ${message.data.length} cells, expected width x height = ${width * height}`,
    );
  }
  const rows: string[] = [];
  for (let i = height - 1; i >= 0; i--) {
    let row = '';
    for (let j = 0; j < width; j++) {
      const value = message.data[i * width + j];
      row += value === -1 ? '?' : classifyOccupancy(value, { occupied_thresh: 0.65, free_thresh: 0.196 });
    }
    rows.push(row);
  }
  // float32 resolution: keep the decimal the writer meant (0.05 stored as 0.0500000007).
  const cleanResolution = Number(resolution.toPrecision(7));
  return { resolution: cleanResolution, origin: [origin.position.x, origin.position.y], width, height, rows };
}
