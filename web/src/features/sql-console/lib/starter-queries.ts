/** A ready-made query over the bundle's tables; shown only when every table it reads exists. */
export interface StarterQuery {
  id: string;
  label: string;
  needs: readonly string[];
  sql: string | ((tables: readonly string[]) => string);
}

/** Tables that have a time column `t` (s since the bundle's start_time). */
const TIMED_TABLES = [
  'odometry',
  'scans',
  'detections',
  'onboard_pose',
  'events',
  'commands',
  'reference_pose',
];

export const STARTER_QUERIES: readonly StarterQuery[] = [
  {
    id: 'odometry-jumps',
    label: 'Largest odometry jumps',
    needs: ['odometry'],
    sql: `-- Largest position jumps between consecutive odometry rows (m), with the time step (s)
SELECT t, prev_t, round(sqrt(pow(x - prev_x, 2) + pow(y - prev_y, 2)), 4) AS jump_m,
       round(t - prev_t, 4) AS dt_s
FROM (
  SELECT t, x, y, lag(t) OVER w AS prev_t, lag(x) OVER w AS prev_x, lag(y) OVER w AS prev_y
  FROM odometry WINDOW w AS (ORDER BY t)
)
WHERE prev_t IS NOT NULL
ORDER BY jump_m DESC
LIMIT 20;`,
  },
  {
    id: 'time-gaps',
    label: 'Time gaps per stream',
    needs: ['odometry'],
    sql: (tables) => {
      const streams = TIMED_TABLES.filter((name) => tables.includes(name));
      const gaps = streams
        .map((name) => `  SELECT '${name}' AS stream, t - lag(t) OVER (ORDER BY t) AS gap_s FROM ${name}`)
        .join('\n  UNION ALL\n');
      return `-- Gaps between consecutive timestamps of each stream (s)
WITH gaps AS (
${gaps}
)
SELECT stream, count(*) AS intervals, round(median(gap_s), 4) AS median_gap_s, round(max(gap_s), 4) AS max_gap_s
FROM gaps
WHERE gap_s IS NOT NULL
GROUP BY stream
ORDER BY max_gap_s DESC;`;
    },
  },
  {
    id: 'events-near-incident',
    label: 'Events within ±5 s of the first contact or protective stop',
    needs: ['events'],
    sql: `-- Events within 5 s either side of the first contact or protective stop
WITH incident AS (
  SELECT min(t) AS t0 FROM events WHERE kind IN ('contact', 'protective_stop')
)
SELECT e.t, round(e.t - incident.t0, 3) AS offset_s, e.kind, e.detail
FROM events e, incident
WHERE e.t BETWEEN incident.t0 - 5 AND incident.t0 + 5
ORDER BY e.t;`,
  },
  {
    id: 'detections-per-class',
    label: 'Detections per class',
    needs: ['detections'],
    sql: `-- Landmark detections per class, with mean range (m)
SELECT class, count(*) AS detections, round(avg(range), 3) AS mean_range_m
FROM detections
GROUP BY class
ORDER BY detections DESC;`,
  },
  {
    id: 'scans-missing-returns',
    label: 'Scans with the most missing returns',
    needs: ['scans'],
    sql: `-- Scans with the most beams that had no return (null ranges)
SELECT t, scan_index, len(ranges) AS beams,
       len(ranges) - list_aggregate(ranges, 'count') AS missing_returns
FROM scans
ORDER BY missing_returns DESC, t
LIMIT 20;`,
  },
];

/** The starter queries this bundle can run, with their SQL written for its tables. */
export function startersFor(tables: readonly string[]): { id: string; label: string; sql: string }[] {
  return STARTER_QUERIES.filter((starter) => starter.needs.every((name) => tables.includes(name))).map(
    (starter) => ({
      id: starter.id,
      label: starter.label,
      sql: typeof starter.sql === 'function' ? starter.sql(tables) : starter.sql,
    }),
  );
}
