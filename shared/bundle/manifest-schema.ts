import { z } from 'zod';
import { MAX_PARTICLES, MAX_SEED, MIN_SEED } from './filter-limits';
import { BUNDLE_FORMAT, type Manifest, RESAMPLING_METHODS, type ResamplingMethod } from './types';

/**
 * Schema of manifest.json (format incident-bundle/1). Objects are strict: the format is versioned,
 * and a misspelt optional block (`recovry`) would otherwise be ignored without a word.
 * `tools/bundle/write-json-schemas.ts` turns this into shared/bundle/schemas/manifest.schema.json.
 */
const finite = z.number();
const positive = z.number().positive();
const nonNegative = z.number().nonnegative();
const probability = z.number().min(0).max(1);
const angle = z.number().gt(-Math.PI).lte(Math.PI).describe('radians in (-pi, pi]');
const positiveInt = z.int().positive();
const particleCount = z.int().min(1).max(MAX_PARTICLES).describe(`1 to ${MAX_PARTICLES} particles`);

const ZFootprint = z.discriminatedUnion('shape', [
  z.strictObject({ shape: z.literal('circle'), radius: positive.describe('m') }),
  z.strictObject({
    shape: z.literal('rectangle'),
    length: positive.describe('m'),
    width: positive.describe('m'),
  }),
]);

const ZRobot = z.strictObject({
  id: z.string().min(1),
  model: z.string(),
  footprint: ZFootprint.describe('Centred on the robot pose'),
  max_speed: positive.describe('m/s'),
  max_decel: positive.describe('m/s^2'),
  reaction_time: nonNegative.describe('s'),
  protective_device: z
    .strictObject({
      name: z.string().min(1),
      detection_capability: positive.describe('mm, d: smallest object the device is sure to detect'),
      response_time: nonNegative.describe('s, detection to output off'),
    })
    .describe('A fixed protective device, for the ISO 13855 minimum distance')
    .optional(),
});

export const ZScanConfig = z.strictObject({
  mount: z.tuple([finite, finite, angle]).describe('Sensor pose [x m, y m, theta rad] in the robot frame'),
  angle_min: angle.describe('Angle of beam 0 in the sensor frame, rad'),
  angle_increment: z
    .number()
    .refine((value) => value !== 0, 'must not be 0')
    .describe('rad per beam'),
  beams: positiveInt.describe('Number of ranges in every scan'),
  range_min: nonNegative.describe('m'),
  range_max: positive.describe('m'),
});

export const ZDetectorConfig = z.strictObject({
  classes: z.array(z.string().min(1)).min(1),
  confusion: z
    .array(z.array(probability))
    .describe('confusion[i][j] = P(report class j | true class i); a square matrix whose rows sum to 1'),
  range_sigma: positive.describe('m'),
  bearing_sigma: positive.describe('rad'),
  max_range: positive.describe('m'),
  clutter: z.number().min(0).lt(1).describe('Probability that a detection is spurious'),
});

const ZFilter = z.strictObject({
  particles: particleCount,
  seed: z.int().min(MIN_SEED).max(MAX_SEED),
  motion: z.strictObject({
    model: z.literal('odometry'),
    alpha: z
      .tuple([nonNegative, nonNegative, nonNegative, nonNegative])
      .describe('Variance coefficients a1..a4 of the odometry motion model (Thrun et al. 2005, Table 5.6)'),
  }),
  scan_model: z
    .strictObject({
      model: z.literal('likelihood_field'),
      z_hit: probability,
      z_rand: probability,
      sigma_hit: positive.describe('m'),
      beams_used: positiveInt,
    })
    .optional(),
  resampling: z.strictObject({
    method: z.enum(RESAMPLING_METHODS as [ResamplingMethod, ...ResamplingMethod[]]),
    threshold: probability.describe('Resample when ESS < threshold * particles'),
  }),
  initial: z.discriminatedUnion('mode', [
    z.strictObject({
      mode: z.literal('pose'),
      x: finite,
      y: finite,
      theta: angle,
      sigma_xy: nonNegative.describe('m'),
      sigma_theta: nonNegative.describe('rad'),
    }),
    z.strictObject({ mode: z.literal('global').describe('Uniform over the free cells of the grid') }),
  ]),
  recovery: z
    .strictObject({ enabled: z.boolean(), alpha_slow: probability, alpha_fast: probability })
    .describe('Augmented MCL random-particle recovery (Thrun et al. 2005, Table 8.3)')
    .optional(),
  kld: z
    .strictObject({
      enabled: z.boolean(),
      epsilon: positive,
      delta: z.number().gt(0).lt(1),
      bin_size: z.tuple([positive, positive, positive]).describe('[m, m, rad]'),
      min_particles: particleCount,
      max_particles: particleCount,
    })
    .describe('KLD-sampling (Fox 2003)')
    .optional(),
});

const ZProvenance = z
  .strictObject({
    importer: z.string(),
    sources: z.array(
      z.strictObject({
        role: z.enum(['recording', 'map', 'map_image', 'params', 'robot']),
        name: z.string(),
        sha256: z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lower-case hex'),
        format: z.string(),
      }),
    ),
    topics: z.record(z.string(), z.string()),
    assumed: z.array(z.string()),
    approximated: z.array(z.string()),
    notes: z.record(z.string(), z.string()),
  })
  .describe('Originals a bundle derived from a robot recording came from (docs/robot-recordings.md)');

export const ZManifest = z.strictObject({
  format: z.literal(BUNDLE_FORMAT),
  robot: ZRobot,
  site: z.string(),
  start_time: z.iso.datetime({ offset: true }).describe('RFC 3339; every t is seconds since this instant'),
  scan: ZScanConfig.optional(),
  detector: ZDetectorConfig.optional(),
  filter: ZFilter,
  provenance: ZProvenance.optional(),
});

// Fails to compile if the schema and the hand-written `Manifest` type drift apart.
export type ManifestSchemaMatchesType =
  z.infer<typeof ZManifest> extends Manifest
    ? Manifest extends z.infer<typeof ZManifest>
      ? true
      : never
    : never;
const manifestSchemaMatchesType: ManifestSchemaMatchesType = true;
void manifestSchemaMatchesType;
