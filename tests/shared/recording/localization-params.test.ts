import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { mapLocalizationParams } from '../../../shared/recording/localization-params';

/**
 * Parameter names and meanings of the widely used AMCL localization node (ROS 1 wiki amcl page
 * and the ROS 2 navigation documentation, from memory); the odometry noise conventions are the
 * textbook's (Thrun, Burgard and Fox 2005, Table 5.6: alphas scale variances).
 */
describe('localization parameter files', () => {
  it('reads the ROS 2 ros__parameters form', () => {
    const mapping = mapLocalizationParams(
      parse(`amcl:
  ros__parameters:
    max_particles: 2000
    min_particles: 500
    pf_z: 0.99
    robot_model_type: "nav2_amcl::DifferentialMotionModel"
    alpha1: 0.2
    alpha2: 0.1
    alpha3: 0.3
    alpha4: 0.05
    laser_z_hit: 0.5
    laser_z_rand: 0.5
    laser_sigma_hit: 0.2
    laser_max_beams: 60
    update_min_d: 0.25
    update_min_a: 0.2
    resample_interval: 1
    recovery_alpha_slow: 0.001
    recovery_alpha_fast: 0.1
`),
      'nav2.yaml',
    );
    expect(mapping.filter.particles).toBe(2000);
    expect(mapping.filter.kld).toMatchObject({ min_particles: 500, max_particles: 2000 });
    // 1 - Phi(0.99) = 0.1611 (standard normal table, e.g. Abramowitz and Stegun Table 26.1).
    expect(mapping.filter.kld?.delta).toBeCloseTo(0.1611, 3);
    expect(mapping.gate).toEqual({ distance: 0.25, angle: 0.2 });
    // Legacy (standard-deviation) reading: b1 r^2 + b2 d^2 must equal (a1 r^2 + a2 d^2)^2 at the
    // gating step r = 0.2 rad, d = 0.25 m: (0.2 * 0.04 + 0.1 * 0.0625)^2 = 0.00014250... computed by hand.
    const [b1, b2, b3, b4] = mapping.filter.motion?.alpha ?? [0, 0, 0, 0];
    expect(b1 * 0.04 + b2 * 0.0625).toBeCloseTo((0.2 * 0.04 + 0.1 * 0.0625) ** 2, 12);
    expect(b3 * 0.0625 + b4 * 2 * 0.04).toBeGreaterThan(0);
    expect(mapping.approximated.some((line) => line.includes('standard-deviation'))).toBe(true);
    expect(mapping.approximated.some((line) => line.includes('sum of the cubes'))).toBe(true);
    expect(mapping.filter.resampling).toEqual({ method: 'multinomial', threshold: 1 });
    expect(mapping.filter.recovery).toEqual({ enabled: true, alpha_slow: 0.001, alpha_fast: 0.1 });
  });

  it("passes a corrected model's alphas through as variances (ROS 1 flat form)", () => {
    const mapping = mapLocalizationParams(
      parse(
        'odom_model_type: diff-corrected\nodom_alpha1: 0.005\nodom_alpha2: 0.005\nodom_alpha3: 0.01\nodom_alpha4: 0.005\ninitial_pose_x: 2\ninitial_pose_y: 3\ninitial_pose_a: 0.5\nresample_interval: 2\n',
      ),
      'amcl.yaml',
    );
    expect(mapping.filter.motion?.alpha).toEqual([0.005, 0.005, 0.01, 0.005]);
    expect(mapping.gate).toBeUndefined();
    expect(mapping.initialPose).toMatchObject({ x: 2, y: 3, theta: 0.5 });
    expect(mapping.approximated.some((line) => line.includes('every 2 updates'))).toBe(true);
  });

  it('names the file and key of a value that is not a number', () => {
    expect(() => mapLocalizationParams({ max_particles: 'many' }, 'amcl.yaml')).toThrow(
      'amcl.yaml: max_particles: expected a number, found "many"',
    );
  });
});
