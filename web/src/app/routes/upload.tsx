import { PageHeader } from '@web/components/page-header';
import { paths } from '@web/config/paths';
import { UploadView } from '@web/features/bundles/components/upload-view';
import { ArrowLeft } from 'lucide-react';
import { Link, useParams } from 'react-router-dom';

export function UploadRoute() {
  const { caseId = '' } = useParams();
  return (
    <>
      <PageHeader
        eyebrow={
          <Link
            to={paths.caseDetail.href(caseId)}
            className="inline-flex items-center gap-1 text-accent hover:underline"
          >
            <ArrowLeft aria-hidden className="size-4" /> Back to the case
          </Link>
        }
        title="Upload an incident bundle"
        description="A .zip with manifest.json, map.json, odometry.csv and the optional logs. It is checked file by file; problems are listed with file, line and field."
      />
      <UploadView caseId={caseId} />
    </>
  );
}
