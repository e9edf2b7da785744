import type { FilterConfig } from '../bundle/types';

/**
 * A localization node's parameter file (the widely used AMCL parameter names, ROS 2
 * `node: { ros__parameters: {...} }` form or ROS 1 flat form) turned into the manifest's filter
 * settings. Where the textbook engine cannot do exactly what the node does, the settings are the
 * closest ones and `approximated` says what differs; docs/robot-recordings.md gives every rule.
 */
export interface ParamsMapping {
  filter: Partial<FilterConfig>;
  /** Update gating: a scan is used only after this much travel (m) or turn (rad) since the last used one. */
  gate?: { distance: number; angle: number };
  /** Initial pose from the file, used when the recording has no onboard estimate at the cut. */
  initialPose?: { x: number; y: number; theta: number; sigma_xy: number; sigma_theta: number };
  approximated: string[];
  notes: string[];
}

type Params = Record<string, unknown>;

/** Finds the parameter block: `<node>: { ros__parameters: {...} }`, `<node>: {...}` or flat. */
export function findParameterBlock(document: unknown): Params {
  if (!document || typeof document !== 'object') return {};
  const root = document as Params;
  for (const value of Object.values(root)) {
    if (value && typeof value === 'object' && 'ros__parameters' in (value as Params)) {
      return ((value as Params).ros__parameters ?? {}) as Params;
    }
  }
  if ('max_particles' in root || 'odom_alpha1' in root || 'alpha1' in root) return root;
  for (const value of Object.values(root)) {
    if (
      value &&
      typeof value === 'object' &&
      ('max_particles' in (value as Params) || 'odom_alpha1' in (value as Params))
    ) {
      return value as Params;
    }
  }
  return root;
}

/** Standard normal upper-tail probability 1 - Phi(z), Abramowitz and Stegun 7.1.26 via erfc. */
function upperTail(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const erfc =
    t *
    (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) *
    Math.exp(-x * x);
  return z >= 0 ? erfc / 2 : 1 - erfc / 2;
}

export function mapLocalizationParams(document: unknown, file: string): ParamsMapping {
  const p = findParameterBlock(document);
  const approximated: string[] = [];
  const notes: string[] = [];
  const filter: Partial<FilterConfig> = {};
  const num = (...keys: string[]): number | undefined => {
    for (const key of keys) {
      const value = p[key];
      if (value === undefined) continue;
      if (typeof value !== 'number' || !Number.isFinite(value)) {
        throw new Error(`${file}: ${key}: expected a number, found ${JSON.stringify(value)}`);
      }
      return value;
    }
    return undefined;
  };
  const str = (...keys: string[]) =>
    keys.map((key) => p[key]).find((value) => typeof value === 'string') as string | undefined;

  const maxParticles = num('max_particles');
  const minParticles = num('min_particles');
  if (maxParticles !== undefined) filter.particles = Math.round(maxParticles);
  if (maxParticles !== undefined && minParticles !== undefined && minParticles < maxParticles) {
    const kldZ = num('pf_z', 'kld_z') ?? 0.99;
    filter.kld = {
      enabled: true,
      epsilon: num('pf_err', 'kld_err') ?? 0.01,
      delta: Math.min(0.5, Math.max(1e-6, upperTail(kldZ))),
      // The node's histogram cells (0.5 m, 0.5 m, 10 degrees; from memory of its source).
      bin_size: [0.5, 0.5, (10 * Math.PI) / 180],
      min_particles: Math.round(minParticles),
      max_particles: Math.round(maxParticles),
    };
    notes.push(`KLD-sampling: delta = 1 - Phi(z) from z = ${kldZ}`);
  }

  const alphas = [1, 2, 3, 4].map((i) => num(`alpha${i}`, `odom_alpha${i}`));
  const model = str('robot_model_type', 'odom_model_type') ?? 'diff';
  const isOmni = /omni/i.test(model);
  const isCorrected = /corrected/i.test(model);
  // Gating only when the file sets it: a recording replayed without it uses every scan.
  const givenDistance = num('update_min_d');
  const givenAngle = num('update_min_a');
  const isGated = givenDistance !== undefined || givenAngle !== undefined;
  const gateDistance = givenDistance ?? 0.2;
  const gateAngle = givenAngle ?? Math.PI / 6;
  if (alphas.every((a) => a !== undefined)) {
    const [a1, a2, a3, a4] = alphas as number[];
    if (isCorrected) {
      filter.motion = { model: 'odometry', alpha: [a1, a2, a3, a4] };
    } else {
      // Legacy form: the node draws noise with standard deviation a1 rot^2 + a2 trans^2, where the
      // textbook (and the engine) use that expression as a variance. Matched exactly at one
      // gating step (rot = update_min_a, trans = update_min_d): b1 r^2 + b2 d^2 = (a1 r^2 + a2 d^2)^2.
      const r2 = gateAngle * gateAngle;
      const d2 = gateDistance * gateDistance;
      filter.motion = {
        model: 'odometry',
        alpha: [
          a1 * a1 * r2 + a1 * a2 * d2,
          a2 * a2 * d2 + a1 * a2 * r2,
          a3 * a3 * d2 + a3 * a4 * r2,
          a4 * a4 * r2 + a3 * a4 * d2,
        ],
      };
      approximated.push(
        `odometry noise: ${model} reads alpha1..alpha4 as standard-deviation coefficients; converted to variance coefficients matching at one gating step (${gateDistance} m, ${gateAngle.toFixed(4)} rad)`,
      );
    }
    if (isOmni)
      approximated.push(
        `odometry model ${model}: the engine's model is differential; alpha5 (sideways noise) is not used`,
      );
  }

  const laserModel = str('laser_model_type') ?? 'likelihood_field';
  const zHit = num('laser_z_hit', 'z_hit');
  const zRand = num('laser_z_rand', 'z_rand');
  const sigmaHit = num('laser_sigma_hit', 'sigma_hit');
  const beams = num('laser_max_beams', 'max_beams');
  if (zHit !== undefined || zRand !== undefined || sigmaHit !== undefined || beams !== undefined) {
    filter.scan_model = {
      model: 'likelihood_field',
      z_hit: zHit ?? 0.5,
      z_rand: zRand ?? 0.5,
      sigma_hit: sigmaHit ?? 0.2,
      beams_used: Math.round(beams ?? 60),
    };
    if (laserModel !== 'likelihood_field')
      approximated.push(`laser model ${laserModel}: replayed with the likelihood field`);
    approximated.push(
      'beam combination: the node scores a scan as 1 + the sum of the cubes of the beam likelihoods; the engine multiplies them (the textbook product)',
    );
  }

  const interval = num('resample_interval');
  if (interval !== undefined) {
    filter.resampling = { method: 'multinomial', threshold: interval <= 1 ? 1 : 0.5 };
    if (interval > 1) {
      approximated.push(`resampling every ${interval} updates: replayed as resampling when ESS < 0.5 N`);
    } else {
      notes.push('resampling after every update: ESS threshold 1');
    }
  }

  const slow = num('recovery_alpha_slow');
  const fast = num('recovery_alpha_fast');
  if (slow !== undefined || fast !== undefined) {
    const isOn = (slow ?? 0) > 0 && (fast ?? 0) > 0;
    filter.recovery = { enabled: isOn, alpha_slow: slow ?? 0, alpha_fast: fast ?? 0 };
  }

  const ros2Initial = p.initial_pose as Params | undefined;
  const ix = num('initial_pose_x') ?? (ros2Initial?.x as number | undefined);
  const iy = num('initial_pose_y') ?? (ros2Initial?.y as number | undefined);
  const ia = num('initial_pose_a') ?? (ros2Initial?.yaw as number | undefined);
  const initialPose =
    ix !== undefined && iy !== undefined
      ? {
          x: ix,
          y: iy,
          theta: ia ?? 0,
          sigma_xy: Math.sqrt(Math.max(num('initial_cov_xx') ?? 0.25, num('initial_cov_yy') ?? 0.25)),
          sigma_theta: Math.sqrt(num('initial_cov_aa') ?? (Math.PI / 12) ** 2),
        }
      : undefined;

  if (isGated)
    notes.push(
      `update gating: a scan is used after more than ${gateDistance} m or ${gateAngle} rad of odometry`,
    );
  return {
    filter,
    gate: isGated ? { distance: gateDistance, angle: gateAngle } : undefined,
    initialPose,
    approximated,
    notes,
  };
}
