/**
 * Signed travel speed (m/s, + forward, - astern) at each replay step. From odometry: the
 * displacement since the previous reading projected on the heading, over the time between them;
 * step 0 takes step 1's value. From commands.csv: the last command at or before the step.
 */
import type { CommandTable, OdometryTable } from '../bundle/types';
import { cos, sin } from '../engine/numerics';

export type SpeedSource = 'odometry' | 'commands';

export function odometrySpeedAtSteps(odometry: OdometryTable): Float64Array {
  const n = odometry.t.length;
  const speed = new Float64Array(n);
  for (let k = 1; k < n; k++) {
    const dt = odometry.t[k] - odometry.t[k - 1];
    if (!(dt > 0)) {
      speed[k] = speed[k - 1];
      continue;
    }
    const heading = odometry.theta[k - 1];
    const along =
      (odometry.x[k] - odometry.x[k - 1]) * cos(heading) + (odometry.y[k] - odometry.y[k - 1]) * sin(heading);
    speed[k] = along / dt;
  }
  if (n > 1) speed[0] = speed[1];
  return speed;
}

export function commandSpeedAtSteps(commands: CommandTable, stepTimes: Float64Array): Float64Array {
  const speed = new Float64Array(stepTimes.length);
  let c = -1;
  for (let s = 0; s < stepTimes.length; s++) {
    while (c + 1 < commands.t.length && commands.t[c + 1] <= stepTimes[s]) c++;
    speed[s] = c >= 0 ? commands.v[c] : 0;
  }
  return speed;
}
