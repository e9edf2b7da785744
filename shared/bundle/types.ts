/**
 * Typed, parsed form of an incident bundle (format `incident-bundle/1`, see docs/bundle-format.md).
 * Units are SI: metres, radians, seconds. Every `t` is seconds since `manifest.start_time`.
 * Tables are struct-of-arrays (one typed array per column) so the replay engine can read them
 * without per-row objects.
 */

export const BUNDLE_FORMAT = 'incident-bundle/1';

export type Footprint =
  | { shape: 'circle'; radius: number }
  | { shape: 'rectangle'; length: number; width: number };

export interface RobotInfo {
  id: string;
  model: string;
  footprint: Footprint;
  /** m/s */
  max_speed: number;
  /** m/s^2 */
  max_decel: number;
  /** s */
  reaction_time: number;
  /** A fixed protective device (e.g. a safety laser scanner field), for the ISO 13855 minimum distance. */
  protective_device?: ProtectiveDevice;
}

export interface ProtectiveDevice {
  name: string;
  /** mm, d: the smallest object the device is sure to detect */
  detection_capability: number;
  /** s: from detection to the device's output switching off */
  response_time: number;
}

export interface ScanConfig {
  /** Sensor pose [x, y, theta] in the robot frame (m, m, rad). */
  mount: [number, number, number];
  angle_min: number;
  angle_increment: number;
  beams: number;
  range_min: number;
  range_max: number;
}

export interface DetectorConfig {
  classes: string[];
  /** confusion[i][j] = P(report class j | true class i); rows sum to 1. */
  confusion: number[][];
  range_sigma: number;
  bearing_sigma: number;
  max_range: number;
  /** Probability that a detection is spurious. */
  clutter: number;
}

export type ResamplingMethod = 'multinomial' | 'stratified' | 'systematic' | 'residual';
export const RESAMPLING_METHODS: readonly ResamplingMethod[] = [
  'multinomial',
  'stratified',
  'systematic',
  'residual',
];

export interface MotionConfig {
  model: 'odometry';
  /** Variance coefficients a1..a4 of the odometry motion model (Thrun et al. 2005, Table 5.6). */
  alpha: [number, number, number, number];
}

export interface ScanModelConfig {
  model: 'likelihood_field';
  z_hit: number;
  z_rand: number;
  /** m */
  sigma_hit: number;
  beams_used: number;
}

export interface ResamplingConfig {
  method: ResamplingMethod;
  /** Resample when ESS < threshold * N. */
  threshold: number;
}

export type InitialBelief =
  | { mode: 'pose'; x: number; y: number; theta: number; sigma_xy: number; sigma_theta: number }
  | { mode: 'global' };

/** Augmented MCL recovery (Thrun et al. 2005, Table 8.3). Optional in the manifest; off by default. */
export interface RecoveryConfig {
  enabled: boolean;
  alpha_slow: number;
  alpha_fast: number;
}

/** KLD-sampling (Fox 2003). Optional in the manifest; off by default. */
export interface KldConfig {
  enabled: boolean;
  epsilon: number;
  /** Upper quantile z_{1-delta} is derived from delta. */
  delta: number;
  /** Histogram bin size [m, m, rad]. */
  bin_size: [number, number, number];
  min_particles: number;
  max_particles: number;
}

export interface FilterConfig {
  particles: number;
  seed: number;
  motion: MotionConfig;
  scan_model?: ScanModelConfig;
  resampling: ResamplingConfig;
  initial: InitialBelief;
  recovery?: RecoveryConfig;
  kld?: KldConfig;
}

export interface Manifest {
  format: typeof BUNDLE_FORMAT;
  robot: RobotInfo;
  site: string;
  /** RFC 3339 */
  start_time: string;
  scan?: ScanConfig;
  detector?: DetectorConfig;
  filter: FilterConfig;
  /** Where a bundle derived from a robot recording came from (absent for bundles written directly). */
  provenance?: Provenance;
}

/** One original file a derived bundle was read from, kept as evidence. */
export interface ProvenanceSource {
  role: 'recording' | 'map' | 'map_image' | 'params' | 'robot';
  name: string;
  sha256: string;
  format: string;
}

/**
 * What a derived bundle owes to its originals: their hashes, which values were assumed (no
 * recording holds them), which settings the engine could only approximate, and notes per file.
 */
export interface Provenance {
  importer: string;
  sources: ProvenanceSource[];
  /** Recording topic used for each role, e.g. `{ "scans": "/scan" }`. */
  topics: Record<string, string>;
  assumed: string[];
  approximated: string[];
  notes: Record<string, string>;
}

export interface Landmark {
  id: string;
  class: string;
  x: number;
  y: number;
}

/** Cell codes in `OccupancyGrid.cells`. */
export const CELL_FREE = 0;
export const CELL_OCCUPIED = 1;
export const CELL_UNKNOWN = 2;

export interface OccupancyGrid {
  /** m per cell */
  resolution: number;
  width: number;
  height: number;
  /** Map-frame position of the grid's south-west corner, m. */
  origin: [number, number];
  /**
   * Row-major cell codes, `cells[i * width + j]`, with row 0 the NORTHMOST row as in map.json:
   * cell (i, j) has its centre at x = origin_x + (j + 0.5) * res, y = origin_y + (height - i - 0.5) * res.
   */
  cells: Uint8Array;
}

export interface SiteMap {
  resolution: number;
  origin: [number, number];
  width: number;
  height: number;
  /** Absent for a landmark-only map. */
  grid?: OccupancyGrid;
  landmarks: Landmark[];
}

export interface PoseColumns {
  t: Float64Array;
  x: Float64Array;
  y: Float64Array;
  theta: Float64Array;
}

export type OdometryTable = PoseColumns;

export interface ScanTable {
  t: Float64Array;
  count: number;
  beams: number;
  /** `count * beams` ranges in m, scan-major; NaN where the file has `null` (no return). */
  ranges: Float32Array;
}

export interface DetectionTable {
  t: Float64Array;
  /** Index into `manifest.detector.classes`. */
  classIndex: Int32Array;
  range: Float64Array;
  bearing: Float64Array;
}

export interface OnboardPoseTable extends PoseColumns {
  /** Present when the file has the covariance columns. */
  cov?: { xx: Float64Array; xy: Float64Array; yy: Float64Array; tt: Float64Array };
}

export interface EventTable {
  t: Float64Array;
  kind: string[];
  detail: string[];
}

export interface CommandTable {
  t: Float64Array;
  v: Float64Array;
  omega: Float64Array;
}

export interface ReferencePoseTable extends PoseColumns {
  source: string[];
}

export interface Bundle {
  manifest: Manifest;
  map: SiteMap;
  odometry: OdometryTable;
  scans?: ScanTable;
  detections?: DetectionTable;
  onboard?: OnboardPoseTable;
  events?: EventTable;
  commands?: CommandTable;
  reference?: ReferencePoseTable;
}

export const BUNDLE_FILES = [
  'manifest.json',
  'map.json',
  'odometry.csv',
  'scans.ndjson',
  'detections.csv',
  'onboard_pose.csv',
  'events.csv',
  'commands.csv',
  'reference_pose.csv',
] as const;
export type BundleFileName = (typeof BUNDLE_FILES)[number];
export const REQUIRED_BUNDLE_FILES: readonly BundleFileName[] = ['manifest.json', 'map.json', 'odometry.csv'];

/** One validation problem, located precisely enough for a person to fix it. */
export interface BundleIssue {
  file: string;
  /** 1-based line (a CSV header is line 1); absent for JSON files and whole-file problems. */
  line?: number;
  /** JSON path (e.g. `detector.confusion[1]`) or CSV column name. */
  field?: string;
  message: string;
  expected?: string;
  found?: string;
  /** Absent means `error`. Warnings (e.g. an unknown extra file) do not make a bundle invalid. */
  severity?: 'error' | 'warning';
}
