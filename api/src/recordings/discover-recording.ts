import { quaternionYaw } from '../../../shared/recording/quaternion-yaw';
import { RecordingError } from './recording-error';
import type { RecordingReader } from './recording-reader';
import { assignRoles, type RecordingRole } from './recording-roles';
import {
  frameName,
  type LaserScanMessage,
  type OdometryMessage,
  type PoseWithCovarianceStampedMessage,
  stampNs,
  type TfMessage,
} from './ros-message-shapes';

export interface OnboardPoseSample {
  stampNs: bigint;
  x: number;
  y: number;
  theta: number;
  cov: ArrayLike<number>;
}

/** What the first read finds: which topic plays which role, the frames, and the fixed facts. */
export interface Discovery {
  roles: Partial<Record<RecordingRole, string>>;
  startNs: bigint;
  endNs: bigint;
  messageCount: number;
  laserFrame?: string;
  baseFrame?: string;
  odomFrame?: string;
  /** Laser pose in the base frame [x, y, yaw], from the static transform. */
  mount?: [number, number, number];
  /** Odometry from `/tf` (the odom to base transform) when it is there, else the Odometry topic. */
  odometrySource?: 'tf' | 'odometry';
  mapMessage?: { message: unknown; yaw: number; timeNs: bigint };
  /** The robot's own estimate at the cut: the last one at or before it, else the first after. */
  initialPose?: OnboardPoseSample;
}

type ProgressFn = (fraction: number) => void;

export async function discoverRecording(
  reader: RecordingReader,
  options: {
    overrides: Partial<Record<RecordingRole, string>>;
    cutNs?: (startNs: bigint) => bigint | undefined;
  },
  onProgress: ProgressFn = () => {},
): Promise<Discovery> {
  // Topics of a stream-read MCAP appear as their channels are read: list them with one pass first.
  const isLazy = reader.topics.size === 0;
  let startNs = reader.startNs;
  let endNs = reader.endNs;
  let messageCount = 0;
  const staticPairs = new Map<string, { parent: string; pose: [number, number, number] }>();
  const dynamicParents = new Map<string, string>();
  let firstScan: LaserScanMessage | undefined;
  let firstOdometry: OdometryMessage | undefined;
  let mapMessage: Discovery['mapMessage'];
  let firstPose: OnboardPoseSample | undefined;
  let lastPoseBefore: OnboardPoseSample | undefined;
  let firstPoseAfter: OnboardPoseSample | undefined;
  let roles: Partial<Record<RecordingRole, string>> = {};
  const assign = () => {
    const assigned = assignRoles([...reader.topics.values()], options.overrides);
    if (assigned.problems.length > 0)
      throw new RecordingError(assigned.problems.join('; '), { file: reader.file });
    roles = assigned.roles;
  };
  if (!isLazy) assign();

  const decodeAs = <T>(topic: string, data: Uint8Array, timeNs: bigint): T => {
    try {
      return reader.topics.get(topic)?.decode(data) as T;
    } catch (error) {
      if (error instanceof RecordingError) throw error;
      throw new RecordingError(`message cannot be decoded (${(error as Error).message})`, {
        file: reader.file,
        topic,
        timeNs,
      });
    }
  };

  for await (const message of reader.messages()) {
    messageCount++;
    if (startNs === undefined || message.logTimeNs < startNs) startNs = message.logTimeNs;
    if (endNs === undefined || message.logTimeNs > endNs) endNs = message.logTimeNs;
    if (isLazy) continue;
    if (reader.startNs !== undefined && reader.endNs !== undefined && reader.endNs > reader.startNs) {
      onProgress(Number(message.logTimeNs - reader.startNs) / Number(reader.endNs - reader.startNs));
    }
    const { topic, data, logTimeNs } = message;
    if (topic === roles.tf_static || topic === roles.tf) {
      const tf = decodeAs<TfMessage>(topic, data, logTimeNs);
      for (const transform of tf.transforms) {
        const child = frameName(transform.child_frame_id);
        const parent = frameName(transform.header.frame_id);
        if (topic === roles.tf_static) {
          const { translation, rotation } = transform.transform;
          staticPairs.set(child, { parent, pose: [translation.x, translation.y, quaternionYaw(rotation)] });
        } else dynamicParents.set(child, parent);
      }
    } else if (topic === roles.scans && !firstScan) {
      firstScan = decodeAs<LaserScanMessage>(topic, data, logTimeNs);
    } else if (topic === roles.odometry && !firstOdometry) {
      firstOdometry = decodeAs<OdometryMessage>(topic, data, logTimeNs);
    } else if (topic === roles.map && !mapMessage) {
      const grid = decodeAs<{
        info: { origin: { orientation: { x: number; y: number; z: number; w: number } } };
      }>(topic, data, logTimeNs);
      mapMessage = { message: grid, yaw: quaternionYaw(grid.info.origin.orientation), timeNs: logTimeNs };
    } else if (topic === roles.onboard_pose) {
      const pose = decodeAs<PoseWithCovarianceStampedMessage>(topic, data, logTimeNs);
      const sample = {
        stampNs: stampNs(pose.header.stamp),
        x: pose.pose.pose.position.x,
        y: pose.pose.pose.position.y,
        theta: quaternionYaw(pose.pose.pose.orientation),
        cov: Array.from(pose.pose.covariance),
      };
      // Only the poses around the cut matter, so nothing grows with the recording.
      const cut = options.cutNs?.(startNs);
      if (cut === undefined) firstPose ??= sample;
      else if (sample.stampNs <= cut) lastPoseBefore = sample;
      else firstPoseAfter ??= sample;
    }
  }
  if (isLazy) {
    if (reader.topics.size === 0) {
      throw new RecordingError(
        `no readable messages${reader.breakNote() ? ` (${reader.breakNote()})` : ''}`,
        { file: reader.file },
      );
    }
    return discoverRecording(reader, options, onProgress);
  }
  if (startNs === undefined || endNs === undefined || messageCount === 0) {
    throw new RecordingError('the recording holds no messages', { file: reader.file });
  }

  const laserFrame = firstScan ? frameName(firstScan.header.frame_id) : undefined;
  let baseFrame = firstOdometry ? frameName(firstOdometry.child_frame_id) : undefined;
  let odomFrame = firstOdometry ? frameName(firstOdometry.header.frame_id) : undefined;
  // Only a static transform mounts the scanner on the robot. A laser frame that moves under a
  // parent on /tf is itself the moving base frame (a scanner at the robot's origin), and that
  // parent is the odometry frame, not the robot.
  if (!baseFrame && laserFrame) baseFrame = staticPairs.get(laserFrame)?.parent ?? laserFrame;
  if (!odomFrame && baseFrame) odomFrame = dynamicParents.get(baseFrame);
  let mount: Discovery['mount'];
  if (laserFrame && baseFrame) {
    if (laserFrame === baseFrame) mount = [0, 0, 0];
    else {
      const pair = staticPairs.get(laserFrame);
      if (pair && pair.parent === baseFrame) mount = pair.pose;
    }
  }
  const hasTfOdometry = Boolean(baseFrame && odomFrame && dynamicParents.get(baseFrame) === odomFrame);
  const odometrySource = hasTfOdometry ? 'tf' : roles.odometry ? 'odometry' : undefined;

  const initialPose = options.cutNs?.(startNs) === undefined ? firstPose : (lastPoseBefore ?? firstPoseAfter);
  return {
    roles,
    startNs,
    endNs,
    messageCount,
    laserFrame,
    baseFrame,
    odomFrame,
    mount,
    odometrySource,
    mapMessage,
    initialPose,
  };
}
