/** Planar pose (m, m, rad) in whichever frame the caller states. */
export interface Pose {
  x: number;
  y: number;
  theta: number;
}

/** Wraps an angle (rad) into (-pi, pi], the bundle format's convention. */
export function normalizeAngle(angle: number): number {
  let wrapped = angle % (2 * Math.PI);
  if (wrapped <= -Math.PI) wrapped += 2 * Math.PI;
  else if (wrapped > Math.PI) wrapped -= 2 * Math.PI;
  return wrapped;
}

/** `base ⊕ delta`: applies `delta`, expressed in `base`'s own frame, to `base`. */
export function composePose(base: Pose, delta: Pose): Pose {
  const cos = Math.cos(base.theta);
  const sin = Math.sin(base.theta);
  return {
    x: base.x + cos * delta.x - sin * delta.y,
    y: base.y + sin * delta.x + cos * delta.y,
    theta: normalizeAngle(base.theta + delta.theta),
  };
}

/** `from⁻¹ ⊕ to`: the pose of `to` expressed in `from`'s frame. */
export function relativePose(from: Pose, to: Pose): Pose {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  const cos = Math.cos(from.theta);
  const sin = Math.sin(from.theta);
  return {
    x: cos * dx + sin * dy,
    y: -sin * dx + cos * dy,
    theta: normalizeAngle(to.theta - from.theta),
  };
}

/**
 * Exact pose change of a differential-drive robot holding (v, omega) for `dt` seconds,
 * expressed in the robot's frame at the start of the interval (arc integration).
 */
export function integrateTwist(v: number, omega: number, dt: number): Pose {
  const dTheta = omega * dt;
  if (Math.abs(dTheta) < 1e-9) return { x: v * dt, y: 0, theta: 0 };
  const radius = v / omega;
  return { x: radius * Math.sin(dTheta), y: radius * (1 - Math.cos(dTheta)), theta: normalizeAngle(dTheta) };
}
