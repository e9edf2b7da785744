import { mkdir, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { parse as parseYaml } from 'yaml';
import type { FilterConfig, Manifest, ProvenanceSource, RobotInfo } from '../../../shared/bundle/types';
import { mapLocalizationParams, type ParamsMapping } from '../../../shared/recording/localization-params';
import {
  MapInputError,
  type MapJson,
  mapFromImage,
  mapFromOccupancyGrid,
  type OccupancyGridMessage,
  parsePgm,
  readMapYaml,
} from '../../../shared/recording/map-server-map';
import { hashFile } from '../bundles/sha256-file';
import { zipFolder } from '../bundles/zip-folder';
import { discoverRecording } from './discover-recording';
import { formatRfc3339, parseImportTime } from './import-times';
import { openRecording } from './open-recording';
import { RecordingError } from './recording-error';
import type { RecordingRole } from './recording-roles';
import { writeRecordingTables } from './write-recording-tables';

export const IMPORTER = 'driftcase-recording-import/1';

export interface ImportRequest {
  source: string;
  map?: string;
  params?: string;
  robot?: string;
  from?: string;
  to?: string;
  /** Investigator's incident time (same forms as --from). */
  incident?: string;
  events?: string[];
  topics?: Partial<Record<RecordingRole, string>>;
  /** Names to record for the originals when they were uploaded under other names. */
  displayNames?: Partial<Record<'recording' | 'map' | 'map_image' | 'params' | 'robot', string>>;
  out: string;
}

export interface ImportSummary {
  format: string;
  topics: Partial<Record<RecordingRole, string>>;
  messages: number;
  rows: Record<string, number>;
  span: { start: string; end: string; seconds: number };
  assumed: string[];
  approximated: string[];
  warnings: string[];
  breakNote?: string;
  sources: ProvenanceSource[];
}

export type ImportProgress = (progress: { phase: 'reading' | 'writing'; fraction: number }) => void;

/** Documented defaults for what no recording holds; each use is listed as assumed. */
const DEFAULT_ROBOT: RobotInfo = {
  id: 'unknown robot',
  model: 'unknown',
  footprint: { shape: 'circle', radius: 0.4 },
  max_speed: 1.5,
  max_decel: 1,
  reaction_time: 0.3,
};
const DEFAULT_FILTER: FilterConfig = {
  particles: 1000,
  seed: 1,
  motion: { model: 'odometry', alpha: [0.2, 0.2, 0.2, 0.2] },
  scan_model: { model: 'likelihood_field', z_hit: 0.5, z_rand: 0.5, sigma_hit: 0.2, beams_used: 60 },
  resampling: { method: 'multinomial', threshold: 0.5 },
  initial: { mode: 'global' },
};

/**
 * Reads a robot recording (and its map, parameter and robot files) into an incident bundle zip.
 * Nothing given is modified: the originals are only read, and their SHA-256 go into the
 * manifest's provenance. Bad input throws RecordingError naming file, topic and message time.
 */
export async function importRecording(
  request: ImportRequest,
  onProgress: ImportProgress = () => {},
): Promise<ImportSummary> {
  const sources: ProvenanceSource[] = [];
  const displayName = (role: ProvenanceSource['role'], file: string) =>
    request.displayNames?.[role] ?? path.basename(file);
  const addSource = async (role: ProvenanceSource['role'], file: string, format: string) => {
    sources.push({ role, name: displayName(role, file), sha256: (await hashFile(file)).sha256, format });
  };
  const reader = await openRecording(request.source);
  const folder = `${request.out}.parts`;
  try {
    if ((await stat(request.source)).isDirectory()) {
      // A rosbag2 folder: every file in it is part of the original, each hashed on its own.
      const folderName = displayName('recording', request.source);
      for (const name of (await readdir(request.source)).sort()) {
        const file = path.join(request.source, name);
        if (!(await stat(file)).isFile()) continue;
        sources.push({
          role: 'recording',
          name: `${folderName}/${name}`,
          sha256: (await hashFile(file)).sha256,
          format: reader.format,
        });
      }
    } else await addSource('recording', request.source, reader.format);
    const assumed: string[] = [];
    const approximated: string[] = [];
    const warnings: string[] = [];
    const notes: Record<string, string> = {};

    let params: ParamsMapping | undefined;
    if (request.params) {
      await addSource('params', request.params, 'localization parameters (YAML)');
      const file = displayName('params', request.params);
      try {
        params = mapLocalizationParams(parseYaml(await readFile(request.params, 'utf8')), file);
      } catch (error) {
        throw new RecordingError((error as Error).message.replace(`${file}: `, ''), { file });
      }
      approximated.push(...params.approximated);
    }

    const cutAt = (startNs: bigint) =>
      request.from ? parseImportTime(request.from, startNs, '--from') : undefined;
    const discovery = await discoverRecording(
      reader,
      {
        overrides: request.topics ?? {},
        cutNs: cutAt,
      },
      (fraction) => onProgress({ phase: 'reading', fraction }),
    );
    const fromNs = request.from ? parseImportTime(request.from, discovery.startNs, '--from') : undefined;
    const toNs = request.to ? parseImportTime(request.to, discovery.startNs, '--to') : undefined;
    if (fromNs !== undefined && toNs !== undefined && toNs <= fromNs) {
      throw new RecordingError(`--to (${request.to}) must be after --from (${request.from})`, {
        file: '--to',
      });
    }
    if (!discovery.odometrySource) {
      throw new RecordingError(
        `no odometry: the recording has neither an odom -> base transform on ${discovery.roles.tf ?? '/tf'} nor a nav_msgs/Odometry topic (name one with --topic odometry=/name)`,
        { file: reader.file },
      );
    }
    if (discovery.roles.scans && !discovery.mount) {
      assumed.push(
        `laser mount [0, 0, 0]: no static transform ${discovery.baseFrame} -> ${discovery.laserFrame}`,
      );
    }

    const map = await readMap(request, discovery, addSource, displayName);
    const zeroNs = fromNs ?? discovery.startNs;
    await rm(folder, { recursive: true, force: true });
    await mkdir(folder, { recursive: true });
    const tables = await writeRecordingTables(
      reader,
      discovery,
      { folder, zeroNs, fromNs, toNs, gate: params?.gate },
      (fraction) => onProgress({ phase: 'writing', fraction }),
    );
    const breakNote = reader.breakNote();
    if (breakNote) warnings.push(breakNote);
    if ((tables.rows['odometry.csv'] ?? 0) === 0) {
      throw new RecordingError('no odometry in the chosen window', {
        file: reader.file,
        topic: discovery.roles.tf,
      });
    }
    for (const [topic, gap] of Object.entries(tables.clockGap)) {
      if (gap > 0.5)
        warnings.push(
          `${topic}: header stamps and recording times differ by up to ${gap.toFixed(3)} s; t uses the header stamps`,
        );
    }
    for (const [table, count] of Object.entries(tables.dropped)) {
      warnings.push(
        `${table}: ${count} message(s) left out (stamp before the bundle's start or not after the previous one)`,
      );
    }
    if (tables.scan) {
      const n = tables.nullRanges;
      notes['scans.ndjson'] =
        `null ranges (REP 117): ${n.noReturn} +Inf (no return), ${n.aboveMax} above range_max (no return), ${n.invalid} NaN (invalid measurement), ${n.belowMin} below range_min or -Inf (too close). ` +
        `${tables.scansGated} scan(s) left out by update gating.`;
    }

    const robot = await readRobot(request, addSource, assumed);
    const filter = buildFilter(params, discovery, assumed);
    const events = await buildEvents(request, discovery.startNs, zeroNs);
    await writeFile(path.join(folder, 'events.csv'), events);
    await writeFile(path.join(folder, 'map.json'), `${JSON.stringify(map)}\n`);
    if (params?.notes.length) notes.filter = params.notes.join('; ');
    const manifest: Manifest = {
      format: 'incident-bundle/1',
      robot: robot.info,
      site: robot.site,
      start_time: formatRfc3339(zeroNs),
      ...(tables.scan ? { scan: tables.scan } : {}),
      filter,
      provenance: {
        importer: IMPORTER,
        sources,
        topics: Object.fromEntries(Object.entries(discovery.roles).filter(([, topic]) => topic)) as Record<
          string,
          string
        >,
        assumed,
        approximated,
        notes,
      },
    };
    await writeFile(path.join(folder, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
    await zipFolder(folder, request.out);
    const endNs = tables.lastNs ?? discovery.endNs;
    return {
      format: reader.format,
      topics: discovery.roles,
      messages: discovery.messageCount,
      rows: tables.rows,
      span: {
        start: formatRfc3339(zeroNs),
        end: formatRfc3339(endNs),
        seconds: Number(endNs - zeroNs) / 1e9,
      },
      assumed,
      approximated,
      warnings,
      breakNote,
      sources,
    };
  } finally {
    await reader.close();
    await rm(folder, { recursive: true, force: true });
  }
}

async function readMap(
  request: ImportRequest,
  discovery: Awaited<ReturnType<typeof discoverRecording>>,
  addSource: (role: ProvenanceSource['role'], file: string, format: string) => Promise<void>,
  displayName: (role: ProvenanceSource['role'], file: string) => string,
): Promise<MapJson> {
  if (request.map) {
    const yamlName = displayName('map', request.map);
    await addSource('map', request.map, 'map_server YAML');
    try {
      const yaml = readMapYaml(parseYaml(await readFile(request.map, 'utf8')), yamlName);
      const imagePath = path.resolve(path.dirname(request.map), yaml.image);
      const image = await readFile(imagePath).catch(() => {
        throw new MapInputError(`${yamlName}: image: ${yaml.image} not found beside the YAML file`);
      });
      await addSource('map_image', imagePath, 'PGM');
      return mapFromImage(yaml, parsePgm(image, displayName('map_image', imagePath)));
    } catch (error) {
      if (error instanceof MapInputError)
        throw new RecordingError(error.message.replace(`${yamlName}: `, ''), { file: yamlName });
      throw new RecordingError(`not a readable map (${(error as Error).message})`, { file: yamlName });
    }
  }
  if (discovery.mapMessage) {
    try {
      return mapFromOccupancyGrid(
        discovery.mapMessage.message as OccupancyGridMessage,
        discovery.mapMessage.yaw,
      );
    } catch (error) {
      throw new RecordingError((error as Error).message, {
        file: displayName('recording', request.source),
        topic: discovery.roles.map,
        timeNs: discovery.mapMessage.timeNs,
      });
    }
  }
  throw new RecordingError(
    "no map: the recording has no nav_msgs/OccupancyGrid topic; give the robot's map with --map map.yaml",
    {
      file: displayName('recording', request.source),
    },
  );
}

async function readRobot(
  request: ImportRequest,
  addSource: (role: ProvenanceSource['role'], file: string, format: string) => Promise<void>,
  assumed: string[],
): Promise<{ info: RobotInfo; site: string }> {
  let given: Partial<RobotInfo> & { site?: string } = {};
  if (request.robot) {
    await addSource('robot', request.robot, 'robot description (JSON)');
    const name = request.displayNames?.robot ?? path.basename(request.robot);
    try {
      given = JSON.parse(await readFile(request.robot, 'utf8'));
    } catch (error) {
      throw new RecordingError(`not valid JSON (${(error as Error).message})`, { file: name });
    }
  }
  const info = { ...DEFAULT_ROBOT };
  for (const key of Object.keys(DEFAULT_ROBOT) as (keyof RobotInfo)[]) {
    if (given[key] !== undefined) (info as Record<string, unknown>)[key] = given[key];
    else assumed.push(`robot.${key} = ${JSON.stringify(DEFAULT_ROBOT[key])} (default)`);
  }
  if (!given.site) assumed.push('site = "unknown site" (default)');
  return { info, site: given.site ?? 'unknown site' };
}

function buildFilter(
  params: ParamsMapping | undefined,
  discovery: Awaited<ReturnType<typeof discoverRecording>>,
  assumed: string[],
): FilterConfig {
  const filter: FilterConfig = { ...DEFAULT_FILTER, ...(params?.filter ?? {}) };
  for (const key of ['particles', 'motion', 'scan_model', 'resampling'] as const) {
    if (params?.filter[key] === undefined)
      assumed.push(`filter.${key} = ${JSON.stringify(DEFAULT_FILTER[key])} (default)`);
  }
  assumed.push('filter.seed = 1 (default: a recording holds no seed)');
  const pose = discovery.initialPose;
  if (pose) {
    const sigmaXy = Math.sqrt(Math.max(pose.cov[0] ?? 0, pose.cov[7] ?? 0));
    filter.initial = {
      mode: 'pose',
      x: pose.x,
      y: pose.y,
      theta: pose.theta,
      sigma_xy: Number.isFinite(sigmaXy) ? sigmaXy : 0.2,
      sigma_theta: Number.isFinite(Math.sqrt(pose.cov[35] ?? 0)) ? Math.sqrt(pose.cov[35] ?? 0) : 0.1,
    };
  } else if (params?.initialPose) {
    filter.initial = { mode: 'pose', ...params.initialPose };
  } else assumed.push('filter.initial = global (no onboard estimate and no initial pose in the parameters)');
  return filter;
}

async function buildEvents(request: ImportRequest, startNs: bigint, zeroNs: bigint): Promise<string> {
  const lines = ['t,kind,detail'];
  const rows: { t: number; kind: string; detail: string }[] = [];
  const quote = (text: string) => (/[",]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text);
  if (request.incident) {
    const t = Number(parseImportTime(request.incident, startNs, '--incident') - zeroNs) / 1e9;
    rows.push({ t, kind: 'incident', detail: 'incident time given by the investigator' });
  }
  for (const event of request.events ?? []) {
    const match = /^([^:]+|\d{4}-\d{2}-\d{2}T[^Z+]*(?:Z|[+-]\d{2}:\d{2})):([a-z_]+):(.*)$/.exec(event);
    if (!match)
      throw new RecordingError(`expected T:KIND:TEXT (e.g. 12.5:contact:bumper), found "${event}"`, {
        file: '--event',
      });
    const t = Number(parseImportTime(match[1], startNs, '--event') - zeroNs) / 1e9;
    rows.push({ t, kind: match[2], detail: match[3] });
  }
  rows.sort((a, b) => a.t - b.t);
  for (const row of rows) {
    if (row.t < 0)
      throw new RecordingError(`event at ${row.t} s is before the bundle's start`, { file: '--event' });
    lines.push(`${row.t},${quote(row.kind)},${quote(row.detail)}`);
  }
  return `${lines.join('\n')}\n`;
}
