import { Alert } from '@web/components/alert';
import { paths } from '@web/config/paths';
import { Microscope } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { RecordingOutcome } from '../api/upload-recording';
import { BundleOverview } from './bundle-overview';
import { ValidationReport } from './validation-report';

/** What reading the recording gave: the bundle's overview or validation report, or why it could not be read. */
export function RecordingOutcomeView({ outcome }: { outcome: RecordingOutcome }) {
  if (outcome.kind === 'unreadable') {
    return (
      <Alert title="The recording could not be read">
        {outcome.message} The uploaded files are kept as evidence on this case and in the audit trail.
      </Alert>
    );
  }
  const { bundle } = outcome;
  return (
    <section aria-labelledby="recording-result-title" className="space-y-3">
      <h3 id="recording-result-title" className="text-sm font-bold">
        Bundle read from the recording
      </h3>
      {outcome.duplicate && (
        <Alert tone="info" title="Already on this case">
          This recording was read before; the bundle made from it is shown.
        </Alert>
      )}
      {bundle.status === 'invalid' && (
        <>
          <Alert title="The bundle made from the recording is not valid">
            It is stored and listed as invalid with its SHA-256, beside the original recording. The problems
            are below.
          </Alert>
          <ValidationReport issues={bundle.issues} />
        </>
      )}
      <BundleOverview
        bundle={bundle}
        actions={
          bundle.status === 'valid' && (
            <Link
              to={paths.workspace.href(bundle.id)}
              className="inline-flex items-center gap-1.5 rounded-md bg-accent px-3 py-1.5 text-sm font-bold text-white"
            >
              <Microscope aria-hidden className="size-4" /> Open workspace
            </Link>
          )
        }
      />
    </section>
  );
}
