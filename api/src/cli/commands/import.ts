import { parseArgs } from 'node:util';
import { formatIssue } from '@shared/bundle/format-issue';
import { inspectBundle } from '../../bundles/inspect-bundle';
import { importRecording } from '../../recordings/import-recording';
import { RecordingError } from '../../recordings/recording-error';
import { RECORDING_ROLES, type RecordingRole } from '../../recordings/recording-roles';

const USAGE = `Usage: npm run cli -- import SOURCE [--map MAP.yaml] [--params PARAMS.yaml] [--robot ROBOT.json]
         [--from T] [--to T] [--topic ROLE=/NAME]... [--incident T] [--event T:KIND:TEXT]... --out BUNDLE.zip
  SOURCE  a .mcap, a ROS 1 .bag, a rosbag2 folder (metadata.yaml) or a .db3
  T       seconds from the recording's start, or an RFC 3339 time
  ROLE    ${RECORDING_ROLES.join(', ')}
`;

/**
 * `import SOURCE ... --out BUNDLE.zip`: reads a robot recording into a validated incident bundle.
 * Exit 0 with a summary, 2 for bad input or options (the message names file, topic and message
 * time), 1 for an internal failure. docs/robot-recordings.md gives every mapping rule.
 */
export async function run(args: string[]): Promise<number> {
  let parsed: ReturnType<typeof parseOptions>;
  try {
    parsed = parseOptions(args);
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\n${USAGE}`);
    return 2;
  }
  const { values, positionals } = parsed;
  if (positionals.length !== 1 || !values.out) {
    process.stderr.write(
      `${positionals.length !== 1 ? 'Give exactly one SOURCE.' : 'Give --out BUNDLE.zip.'}\n${USAGE}`,
    );
    return 2;
  }
  const topics: Partial<Record<RecordingRole, string>> = {};
  for (const entry of values.topic ?? []) {
    const [role, name] = entry.split('=', 2);
    if (!RECORDING_ROLES.includes(role as RecordingRole) || !name?.startsWith('/')) {
      process.stderr.write(
        `--topic ${entry}: expected ROLE=/NAME with ROLE one of ${RECORDING_ROLES.join(', ')}\n`,
      );
      return 2;
    }
    topics[role as RecordingRole] = name;
  }
  try {
    const summary = await importRecording({
      source: positionals[0],
      map: values.map,
      params: values.params,
      robot: values.robot,
      from: values.from,
      to: values.to,
      incident: values.incident,
      events: values.event,
      topics,
      out: values.out,
    });
    const inspection = await inspectBundle({ kind: 'zip', path: values.out });
    const lines = [
      `Imported ${positionals[0]} (${summary.format}) into ${values.out}`,
      `Topics used: ${Object.entries(summary.topics)
        .map(([role, topic]) => `${role} ${topic}`)
        .join(', ')}`,
      `Messages in the recording: ${summary.messages}; rows written: ${Object.entries(summary.rows)
        .map(([file, rows]) => `${file} ${rows}`)
        .join(', ')}`,
      `Time span: ${summary.span.start} to ${summary.span.end} (${summary.span.seconds.toFixed(3)} s)`,
      ...summary.assumed.map((line) => `Assumed: ${line}`),
      ...summary.approximated.map((line) => `Approximated: ${line}`),
      ...summary.warnings.map((line) => `Warning: ${line}`),
      ...summary.sources.map((source) => `Original ${source.role}: ${source.name} SHA-256 ${source.sha256}`),
      `Bundle check: ${inspection.ok ? 'VALID' : 'INVALID'}`,
    ];
    process.stdout.write(`${lines.join('\n')}\n`);
    for (const issue of inspection.issues) process.stderr.write(`${formatIssue(issue)}\n`);
    return inspection.ok ? 0 : 2;
  } catch (error) {
    if (error instanceof RecordingError) {
      process.stderr.write(`${error.message}\n`);
      return 2;
    }
    process.stderr.write(`Internal failure while importing ${positionals[0]}: ${(error as Error).message}\n`);
    return 1;
  }
}

function parseOptions(args: string[]) {
  return parseArgs({
    args,
    allowPositionals: true,
    options: {
      map: { type: 'string' },
      params: { type: 'string' },
      robot: { type: 'string' },
      from: { type: 'string' },
      to: { type: 'string' },
      incident: { type: 'string' },
      topic: { type: 'string', multiple: true },
      event: { type: 'string', multiple: true },
      out: { type: 'string' },
    },
  });
}
