import { RECORDING_FILE_LABELS } from '@shared/human-labels';
import { FormField } from '@web/components/form-field';
import { formatBytes } from '@web/lib/format-bytes';
import { RECORDING_FILE_ROLES, type RecordingFileRole, type RecordingFiles } from '../api/upload-recording';

const ACCEPT: Record<RecordingFileRole, { accept: string; hint: string }> = {
  recording: {
    accept: '.mcap,.bag,.db3',
    hint: 'ROS 2 MCAP (.mcap) or sqlite3 (.db3), or a ROS 1 bag (.bag)',
  },
  map: { accept: '.yaml,.yml', hint: 'the map_server YAML the robot used, when the recording has no map' },
  map_image: { accept: '.pgm,.png,.bmp', hint: 'the image the map YAML names (.pgm)' },
  params: { accept: '.yaml,.yml', hint: "the localization node's parameter file, for the filter settings" },
  robot: {
    accept: '.json',
    hint: 'footprint, deceleration and reaction time; documented defaults otherwise',
  },
};

/** One labelled file field per file the recording upload takes; the recording alone is required. */
export function RecordingFileFields({
  files,
  onChange,
}: {
  files: RecordingFiles;
  onChange: (role: RecordingFileRole, file: File | undefined) => void;
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      {RECORDING_FILE_ROLES.map((role) => (
        <FormField
          key={role}
          label={RECORDING_FILE_LABELS[role] ?? role}
          hint={ACCEPT[role].hint}
          isOptional={role !== 'recording'}
        >
          {(control) => (
            <div>
              <input
                {...control}
                type="file"
                accept={ACCEPT[role].accept}
                className="block w-full text-sm file:mr-3 file:rounded-md file:border file:border-canvas-line file:bg-canvas-raised file:px-3 file:py-1.5 file:text-sm"
                onChange={(event) => onChange(role, event.target.files?.[0])}
              />
              {files[role] && (
                <p className="mt-1 text-xs text-ink-muted" data-testid={`chosen-${role}`}>
                  {files[role]?.name} · {formatBytes(files[role]?.size ?? 0)}
                </p>
              )}
            </div>
          )}
        </FormField>
      ))}
    </div>
  );
}
