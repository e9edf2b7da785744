import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { DropZone } from '@web/components/drop-zone';
import { paths } from '@web/config/paths';
import { FileUp, Microscope, Upload } from 'lucide-react';
import { useId, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { useUploadBundle } from '../api/upload-bundle';
import { BundleOverview } from './bundle-overview';
import { ValidationReport } from './validation-report';

/** Drop or pick a bundle zip, watch it upload, then read its overview or its validation report. */
export function UploadView({ caseId }: { caseId: string }) {
  const inputId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [chosen, setChosen] = useState<File | null>(null);
  const upload = useUploadBundle(caseId);

  const send = (file: File | undefined) => {
    if (!file) return;
    setChosen(file);
    upload.mutate(file);
  };
  const outcome = upload.data;

  return (
    <div className="space-y-5">
      <DropZone onFiles={(files) => send(files[0])} testId="drop-zone" className="py-10">
        <FileUp aria-hidden className="size-8 text-ink-faint" />
        <p className="mt-2 font-bold">Drop an incident bundle (.zip) here</p>
        <p className="text-sm text-ink-muted">
          or choose the file; the original is kept unchanged as evidence.
        </p>
        <label htmlFor={inputId} className="sr-only">
          Bundle file (.zip)
        </label>
        <input
          ref={inputRef}
          id={inputId}
          type="file"
          accept=".zip,application/zip"
          className="sr-only"
          onChange={(event) => send(event.target.files?.[0])}
        />
        <Button
          className="mt-3"
          icon={Upload}
          onClick={() => inputRef.current?.click()}
          isBusy={upload.isPending}
        >
          Choose bundle file
        </Button>
      </DropZone>

      {upload.isPending && chosen && (
        <div aria-live="polite">
          <p className="text-sm">
            Uploading <span className="font-bold">{chosen.name}</span>… {Math.round(upload.progress * 100)} %
            {upload.progress >= 1 && ' — checking the bundle'}
          </p>
          <progress className="h-2 w-full" max={1} value={upload.progress} aria-label="Upload progress" />
        </div>
      )}
      {upload.isError && <Alert title="The upload failed">{upload.error.message}</Alert>}
      {outcome?.kind === 'invalid' && (
        <section
          aria-labelledby="report-title"
          className="rounded-lg border border-canvas-line bg-canvas-raised p-5"
        >
          <h2 id="report-title" className="text-base font-bold">
            Validation report
          </h2>
          <Alert title="The bundle is stored but not valid" className="mt-2">
            {outcome.message} It stays listed on the case as invalid with its SHA-256, so nothing is lost.
          </Alert>
          <div className="mt-4">
            <ValidationReport issues={outcome.issues} />
          </div>
          <div className="mt-6">
            <BundleOverview bundle={outcome.bundle} />
          </div>
        </section>
      )}
      {outcome?.kind === 'valid' && (
        <section
          aria-labelledby="overview-title"
          className="rounded-lg border border-canvas-line bg-canvas-raised p-5"
        >
          <h2 id="overview-title" className="text-base font-bold">
            Bundle overview
          </h2>
          {outcome.duplicate && (
            <Alert tone="info" title="Already on this case" className="mt-2">
              These exact bytes were uploaded before; the stored bundle is shown.
            </Alert>
          )}
          <div className="mt-3">
            <BundleOverview
              bundle={outcome.bundle}
              actions={
                <Link
                  to={paths.workspace.href(outcome.bundle.id)}
                  className="inline-flex items-center gap-1.5 rounded-md bg-accent px-3 py-1.5 text-sm font-bold text-white"
                >
                  <Microscope aria-hidden className="size-4" /> Open workspace
                </Link>
              }
            />
          </div>
        </section>
      )}
    </div>
  );
}
