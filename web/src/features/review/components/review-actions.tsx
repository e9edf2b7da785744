import { REVIEW_WORDS } from '@shared/review-words';
import { Button } from '@web/components/button';
import { FileSignature, MessageSquareWarning } from 'lucide-react';
import { useState } from 'react';
import { RequestChangesDialog } from './request-changes-dialog';
import { SignDialog } from './sign-dialog';

interface ReviewActionsProps {
  caseId: string;
  version: number;
  caution: string;
  /** Only a version awaiting review can be signed or sent back. */
  isAwaitingReview: boolean;
}

/** The reviewer's two choices; the server decides who may sign (never the author) and says why not. */
export function ReviewActions({ caseId, version, caution, isAwaitingReview }: ReviewActionsProps) {
  const [open, setOpen] = useState<'sign' | 'return' | null>(null);
  if (!isAwaitingReview) return null;
  return (
    <div className="flex flex-wrap gap-2 border-t border-canvas-line pt-3">
      <Button variant="primary" icon={FileSignature} onClick={() => setOpen('sign')}>
        {REVIEW_WORDS.signOff}
      </Button>
      <Button icon={MessageSquareWarning} onClick={() => setOpen('return')}>
        {REVIEW_WORDS.returnWithComments}
      </Button>
      {open === 'sign' && (
        <SignDialog caseId={caseId} version={version} caution={caution} onClose={() => setOpen(null)} />
      )}
      {open === 'return' && (
        <RequestChangesDialog caseId={caseId} version={version} onClose={() => setOpen(null)} />
      )}
    </div>
  );
}
