/** What each mapped topic is for, the type it must have, and the name preferred when several fit. */
export const ROLE_TYPES = {
  tf: { types: ['tf2_msgs/TFMessage'], preferred: '/tf' },
  tf_static: { types: ['tf2_msgs/TFMessage'], preferred: '/tf_static' },
  odometry: { types: ['nav_msgs/Odometry'], preferred: '/odom' },
  scans: { types: ['sensor_msgs/LaserScan'], preferred: '/scan' },
  map: { types: ['nav_msgs/OccupancyGrid'], preferred: '/map' },
  onboard_pose: { types: ['geometry_msgs/PoseWithCovarianceStamped'], preferred: '/amcl_pose' },
  commands: { types: ['geometry_msgs/Twist', 'geometry_msgs/TwistStamped'], preferred: '/cmd_vel' },
} as const;

export type RecordingRole = keyof typeof ROLE_TYPES;
export const RECORDING_ROLES = Object.keys(ROLE_TYPES) as RecordingRole[];

/**
 * Picks a topic per role by its type: an override (`--topic scans=/front/scan`) wins, else the
 * preferred name, else the first topic of that type in name order. Two TFMessage topics are told
 * apart by name: one containing "static" is the static tree.
 */
export function assignRoles(
  topics: { name: string; type: string }[],
  overrides: Partial<Record<RecordingRole, string>>,
): { roles: Partial<Record<RecordingRole, string>>; problems: string[] } {
  const roles: Partial<Record<RecordingRole, string>> = {};
  const problems: string[] = [];
  const sorted = [...topics].sort((a, b) => a.name.localeCompare(b.name));
  for (const role of RECORDING_ROLES) {
    const { types, preferred } = ROLE_TYPES[role];
    const override = overrides[role];
    if (override) {
      const topic = topics.find((candidate) => candidate.name === override);
      if (!topic) problems.push(`--topic ${role}=${override}: the recording has no topic ${override}`);
      else if (!(types as readonly string[]).includes(topic.type)) {
        problems.push(
          `--topic ${role}=${override}: topic ${override} is ${topic.type}, expected ${types.join(' or ')}`,
        );
      } else roles[role] = override;
      continue;
    }
    let candidates = sorted.filter((topic) => (types as readonly string[]).includes(topic.type));
    if (role === 'tf') candidates = candidates.filter((topic) => !/static/.test(topic.name));
    if (role === 'tf_static') candidates = candidates.filter((topic) => /static/.test(topic.name));
    const chosen = candidates.find((topic) => topic.name === preferred) ?? candidates[0];
    if (chosen) roles[role] = chosen.name;
  }
  return { roles, problems };
}
