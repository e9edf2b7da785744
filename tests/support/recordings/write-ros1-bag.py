#!/usr/bin/python3
"""Writes an incident bundle folder as a ROS 1 bag with Debian's python3-rosbag, the ROS 1
reference implementation, so the importer is checked against bytes it did not write.

Usage: /usr/bin/python3 write-ros1-bag.py BUNDLE_FOLDER OUT.bag [none|bz2|lz4] [SCAN_LIMIT]

Topics: /tf (odom -> base_link from odometry.csv), /tf_static (base_link -> laser from the scan
mount), /scan (LaserScan; null -> +inf), /amcl_pose (PoseWithCovarianceStamped from
onboard_pose.csv), /cmd_vel (Twist from commands.csv), /map (OccupancyGrid, south row first).
Every header stamp is manifest.start_time + t; the log time equals the stamp.
With SCAN_FRAME=base_link in the environment the scans are stamped in the moving base frame itself
(a scanner at the robot's origin) and no /tf_static is written.
"""
import csv, json, math, os, sys
from datetime import datetime
import rosbag, rospy
from geometry_msgs.msg import PoseWithCovarianceStamped, TransformStamped, Twist
from nav_msgs.msg import OccupancyGrid
from sensor_msgs.msg import LaserScan
from tf2_msgs.msg import TFMessage

folder, out = sys.argv[1], sys.argv[2]
compression = sys.argv[3] if len(sys.argv) > 3 else 'none'
scan_limit = int(sys.argv[4]) if len(sys.argv) > 4 else None
scan_frame = os.environ.get('SCAN_FRAME', 'laser')
manifest = json.load(open(os.path.join(folder, 'manifest.json')))
start = datetime.fromisoformat(manifest['start_time'].replace('Z', '+00:00')).timestamp()

def stamp(t):
    return rospy.Time.from_sec(start + float(t))

def quat(yaw):
    return (0.0, 0.0, math.sin(yaw / 2), math.cos(yaw / 2))

def rows(name):
    path = os.path.join(folder, name)
    return list(csv.DictReader(open(path))) if os.path.exists(path) else []

messages = []
scan = manifest['scan']
static = TransformStamped()
static.header.stamp = stamp(0)
static.header.frame_id = 'base_link'
static.child_frame_id = 'laser'
static.transform.translation.x, static.transform.translation.y = scan['mount'][0], scan['mount'][1]
(static.transform.rotation.x, static.transform.rotation.y, static.transform.rotation.z, static.transform.rotation.w) = quat(scan['mount'][2])
if scan_frame == 'laser':
    messages.append(('/tf_static', TFMessage(transforms=[static]), stamp(0)))

grid_json = json.load(open(os.path.join(folder, 'map.json')))
grid = OccupancyGrid()
grid.header.stamp = stamp(0)
grid.header.frame_id = 'map'
grid.info.resolution = grid_json['resolution']
grid.info.width, grid.info.height = grid_json['width'], grid_json['height']
grid.info.origin.position.x, grid.info.origin.position.y = grid_json['origin']
grid.info.origin.orientation.w = 1.0
code = {'.': 0, '#': 100, '?': -1}
grid.data = [code[c] for row in reversed(grid_json['rows']) for c in row]
messages.append(('/map', grid, stamp(0)))

for row in rows('odometry.csv'):
    tf = TransformStamped()
    tf.header.stamp = stamp(row['t'])
    tf.header.frame_id = 'odom'
    tf.child_frame_id = 'base_link'
    tf.transform.translation.x, tf.transform.translation.y = float(row['x']), float(row['y'])
    (tf.transform.rotation.x, tf.transform.rotation.y, tf.transform.rotation.z, tf.transform.rotation.w) = quat(float(row['theta']))
    messages.append(('/tf', TFMessage(transforms=[tf]), tf.header.stamp))

with open(os.path.join(folder, 'scans.ndjson')) as lines:
    for index, line in enumerate(lines):
        if scan_limit is not None and index >= scan_limit:
            break
        record = json.loads(line)
        msg = LaserScan()
        msg.header.stamp = stamp(record['t'])
        msg.header.frame_id = scan_frame
        msg.angle_min = scan['angle_min']
        msg.angle_increment = scan['angle_increment']
        msg.angle_max = scan['angle_min'] + scan['angle_increment'] * (scan['beams'] - 1)
        msg.range_min, msg.range_max = scan['range_min'], scan['range_max']
        msg.ranges = [float('inf') if r is None else r for r in record['ranges']]
        messages.append(('/scan', msg, msg.header.stamp))

for row in rows('onboard_pose.csv'):
    msg = PoseWithCovarianceStamped()
    msg.header.stamp = stamp(row['t'])
    msg.header.frame_id = 'map'
    msg.pose.pose.position.x, msg.pose.pose.position.y = float(row['x']), float(row['y'])
    (msg.pose.pose.orientation.x, msg.pose.pose.orientation.y, msg.pose.pose.orientation.z, msg.pose.pose.orientation.w) = quat(float(row['theta']))
    cov = [0.0] * 36
    if 'cov_xx' in row:
        cov[0], cov[1], cov[6], cov[7], cov[35] = float(row['cov_xx']), float(row['cov_xy']), float(row['cov_xy']), float(row['cov_yy']), float(row['cov_tt'])
    msg.pose.covariance = cov
    messages.append(('/amcl_pose', msg, msg.header.stamp))

for row in rows('commands.csv'):
    msg = Twist()
    msg.linear.x, msg.angular.z = float(row['v']), float(row['omega'])
    messages.append(('/cmd_vel', msg, stamp(row['t'])))

messages.sort(key=lambda item: item[2])
with rosbag.Bag(out, 'w', compression=compression) as bag:
    for topic, msg, time in messages:
        bag.write(topic, msg, time)
