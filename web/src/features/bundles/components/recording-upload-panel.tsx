import { RECORDING_PROGRESS_WORDS, type TRecordingProgress } from '@shared/contracts/recordings';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { DropZone } from '@web/components/drop-zone';
import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { Bot } from 'lucide-react';
import { type FormEvent, useState } from 'react';
import { useRecordingProgress } from '../api/get-recording-progress';
import { type RecordingFiles, useUploadRecording } from '../api/upload-recording';
import { sortRecordingFiles } from '../lib/sort-recording-files';
import { RecordingFileFields } from './recording-file-fields';
import { RecordingOutcomeView } from './recording-outcome';

/**
 * A robot recording (and its map, parameter and robot files) dropped or chosen on the case page,
 * sent with upload progress; the server keeps every file as evidence before reading it.
 */
export function RecordingUploadPanel({ caseId }: { caseId: string }) {
  const [files, setFiles] = useState<RecordingFiles>({});
  const [incident, setIncident] = useState('');
  const [unrecognised, setUnrecognised] = useState<string[]>([]);
  const [progressId, setProgressId] = useState<string>();
  const upload = useUploadRecording(caseId);
  const isReading = upload.isPending && upload.progress >= 1;
  const serverProgress = useRecordingProgress(caseId, progressId, isReading);

  const takeDropped = async (dropped: File[]) => {
    const sorted = await sortRecordingFiles(dropped);
    setFiles((current) => ({ ...current, ...sorted.files }));
    setUnrecognised(sorted.unrecognised);
  };
  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (!files.recording) return;
    const id = crypto.randomUUID();
    setProgressId(id);
    upload.mutate({ files, incident, progressId: id });
  };

  return (
    <form onSubmit={onSubmit} className="space-y-4" aria-label="Upload a robot recording">
      <DropZone
        onFiles={(dropped) => void takeDropped(dropped)}
        testId="recording-drop-zone"
        className="py-6"
      >
        <Bot aria-hidden className="size-7 text-ink-faint" />
        <p className="mt-2 font-bold">Drop the robot's recording here, with its map and parameter files</p>
        <p className="text-sm text-ink-muted">
          or choose each file below. Every file is kept unchanged as evidence before it is read.
        </p>
      </DropZone>
      {unrecognised.length > 0 && (
        <Alert tone="info" title="Not used">
          {unrecognised.join(', ')}: not a recording, map, parameter or robot file (or a second one of a
          kind).
        </Alert>
      )}
      <RecordingFileFields
        files={files}
        onChange={(role, file) => setFiles((current) => ({ ...current, [role]: file }))}
      />
      <FormField
        label="Incident time"
        hint="seconds from the recording's start (21.5) or an RFC 3339 time; marked on the timeline"
        isOptional
      >
        {(control) => (
          <TextInput {...control} value={incident} onChange={(event) => setIncident(event.target.value)} />
        )}
      </FormField>
      <Button type="submit" variant="primary" disabled={!files.recording} isBusy={upload.isPending}>
        Read recording
      </Button>
      {upload.isPending && !isReading && (
        <div aria-live="polite">
          <p className="text-sm">
            Uploading <span className="font-bold">{files.recording?.name}</span>…{' '}
            {Math.round(upload.progress * 100)} %
          </p>
          <progress
            className="h-2 w-full"
            max={1}
            value={upload.progress}
            aria-label="Recording upload progress"
          />
        </div>
      )}
      {isReading && <ServerProgress progress={serverProgress.data} />}
      {upload.isError && <Alert title="The upload failed">{upload.error.message}</Alert>}
      {upload.data && <RecordingOutcomeView outcome={upload.data} />}
    </form>
  );
}

/** After the bytes arrived: the server's phase and its share, or a plain wait until it answers. */
function ServerProgress({ progress }: { progress?: TRecordingProgress }) {
  const phase = progress && progress.phase !== 'done' && progress.phase !== 'failed' ? progress : undefined;
  return (
    <div aria-live="polite" data-testid="recording-server-progress">
      <p className="text-sm">
        {phase
          ? `${RECORDING_PROGRESS_WORDS[phase.phase]}… ${Math.round(phase.fraction * 100)} %`
          : 'Uploaded; the server is reading the recording…'}
      </p>
      <progress
        className="h-2 w-full"
        max={1}
        value={phase?.fraction}
        aria-label="Recording reading progress"
      />
    </div>
  );
}
