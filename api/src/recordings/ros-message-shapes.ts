/** The fields Driftcase reads from decoded messages; ROS 1 stamps say `nsec`, ROS 2 `nanosec`. */
export interface Stamp {
  sec: number;
  nsec?: number;
  nanosec?: number;
}
export interface Header {
  stamp: Stamp;
  frame_id: string;
}
export interface Quaternion {
  x: number;
  y: number;
  z: number;
  w: number;
}
export interface Vector3 {
  x: number;
  y: number;
  z: number;
}
export interface TransformStamped {
  header: Header;
  child_frame_id: string;
  transform: { translation: Vector3; rotation: Quaternion };
}
export interface TfMessage {
  transforms: TransformStamped[];
}
export interface LaserScanMessage {
  header: Header;
  angle_min: number;
  angle_max: number;
  angle_increment: number;
  range_min: number;
  range_max: number;
  ranges: ArrayLike<number>;
}
export interface PoseMessage {
  position: Vector3;
  orientation: Quaternion;
}
export interface OdometryMessage {
  header: Header;
  child_frame_id: string;
  pose: { pose: PoseMessage };
}
export interface PoseWithCovarianceStampedMessage {
  header: Header;
  pose: { pose: PoseMessage; covariance: ArrayLike<number> };
}
export interface TwistMessage {
  linear: Vector3;
  angular: Vector3;
}
export interface TwistStampedMessage {
  header: Header;
  twist: TwistMessage;
}

export function stampNs(stamp: Stamp): bigint {
  return BigInt(stamp.sec) * 1_000_000_000n + BigInt(stamp.nanosec ?? stamp.nsec ?? 0);
}

/** Frame ids compare without a leading slash (ROS 1 tf allowed `/base_link`, tf2 does not). */
export function frameName(frame: string): string {
  return frame.startsWith('/') ? frame.slice(1) : frame;
}
