/**
 * Yaw (rotation about z, rad in (-pi, pi]) of a unit quaternion, the ZYX Euler convention ROS's
 * tf2 uses (REP 103): yaw = atan2(2 (w z + x y), 1 - 2 (y^2 + z^2)).
 */
export function quaternionYaw(q: { x: number; y: number; z: number; w: number }): number {
  const yaw = Math.atan2(2 * (q.w * q.z + q.x * q.y), 1 - 2 * (q.y * q.y + q.z * q.z));
  return yaw === -Math.PI ? Math.PI : yaw;
}
