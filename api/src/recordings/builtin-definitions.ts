/**
 * ROS 2 message definitions (ros2msg text) of the standard types Driftcase maps, used when a
 * recording does not carry a type's schema (older rosbag2 sqlite3 files never do; some MCAP
 * writers leave it empty). Field lists follow the definitions published in the ROS 2 packages
 * common_interfaces (sensor_msgs, nav_msgs, geometry_msgs, std_msgs) and tf2_msgs.
 */
const HEADER = `MSG: std_msgs/Header
builtin_interfaces/Time stamp
string frame_id`;
const TIME = `MSG: builtin_interfaces/Time
int32 sec
uint32 nanosec`;
const POINT = `MSG: geometry_msgs/Point
float64 x
float64 y
float64 z`;
const QUATERNION = `MSG: geometry_msgs/Quaternion
float64 x
float64 y
float64 z
float64 w`;
const POSE = `MSG: geometry_msgs/Pose
Point position
Quaternion orientation`;
const VECTOR3 = `MSG: geometry_msgs/Vector3
float64 x
float64 y
float64 z`;
const TWIST = `MSG: geometry_msgs/Twist
Vector3 linear
Vector3 angular`;
const POSE_COV = `MSG: geometry_msgs/PoseWithCovariance
Pose pose
float64[36] covariance`;
const TWIST_COV = `MSG: geometry_msgs/TwistWithCovariance
Twist twist
float64[36] covariance`;
const TRANSFORM_STAMPED = `MSG: geometry_msgs/TransformStamped
std_msgs/Header header
string child_frame_id
Transform transform`;
const TRANSFORM = `MSG: geometry_msgs/Transform
Vector3 translation
Quaternion rotation`;
const MAP_META = `MSG: nav_msgs/MapMetaData
builtin_interfaces/Time map_load_time
float32 resolution
uint32 width
uint32 height
geometry_msgs/Pose origin`;

const SEPARATOR = `\n${'='.repeat(80)}\n`;
const join = (main: string, ...dependencies: string[]) => [main, ...dependencies].join(SEPARATOR);

/** Keyed by the normalised type name (`sensor_msgs/LaserScan`, no `/msg/`). */
export const BUILTIN_ROS2_DEFINITIONS: Readonly<Record<string, string>> = {
  'sensor_msgs/LaserScan': join(
    `std_msgs/Header header
float32 angle_min
float32 angle_max
float32 angle_increment
float32 time_increment
float32 scan_time
float32 range_min
float32 range_max
float32[] ranges
float32[] intensities`,
    HEADER,
    TIME,
  ),
  'tf2_msgs/TFMessage': join(
    'geometry_msgs/TransformStamped[] transforms',
    TRANSFORM_STAMPED,
    HEADER,
    TIME,
    TRANSFORM,
    VECTOR3,
    QUATERNION,
  ),
  'nav_msgs/Odometry': join(
    `std_msgs/Header header
string child_frame_id
geometry_msgs/PoseWithCovariance pose
geometry_msgs/TwistWithCovariance twist`,
    HEADER,
    TIME,
    POSE_COV,
    POSE,
    POINT,
    QUATERNION,
    TWIST_COV,
    TWIST,
    VECTOR3,
  ),
  'geometry_msgs/PoseWithCovarianceStamped': join(
    `std_msgs/Header header
geometry_msgs/PoseWithCovariance pose`,
    HEADER,
    TIME,
    POSE_COV,
    POSE,
    POINT,
    QUATERNION,
  ),
  'geometry_msgs/Twist': join('Vector3 linear\nVector3 angular', VECTOR3),
  'geometry_msgs/TwistStamped': join(
    `std_msgs/Header header
geometry_msgs/Twist twist`,
    HEADER,
    TIME,
    TWIST,
    VECTOR3,
  ),
  'nav_msgs/OccupancyGrid': join(
    `std_msgs/Header header
nav_msgs/MapMetaData info
int8[] data`,
    HEADER,
    TIME,
    MAP_META,
    POSE,
    POINT,
    QUATERNION,
  ),
};

/** `sensor_msgs/msg/LaserScan` (ROS 2) and `sensor_msgs/LaserScan` (ROS 1) name the same type. */
export function normaliseTypeName(type: string): string {
  return type.replace('/msg/', '/');
}
