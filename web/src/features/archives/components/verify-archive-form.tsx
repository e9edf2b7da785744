import { ARCHIVE_CHECK_KIND_LABELS } from '@shared/human-labels';
import { Button } from '@web/components/button';
import { CheckCircle2, ShieldCheck, XCircle } from 'lucide-react';
import { type FormEvent, useId, useState } from 'react';
import { useVerifyArchive } from '../api/verify-archive';

/** Upload an archive and see every check the offline verifier runs, failed ones first. */
export function VerifyArchiveForm() {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const verify = useVerifyArchive();
  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (file) verify.mutate(file);
  };
  const result = verify.data;
  const checks = result ? [...result.checks].sort((a, b) => Number(a.ok) - Number(b.ok)) : [];
  return (
    <form
      onSubmit={onSubmit}
      className="space-y-3 border-t border-canvas-line pt-4"
      aria-labelledby={`${inputId}-title`}
    >
      <h3 id={`${inputId}-title`} className="text-xs font-bold uppercase tracking-wide text-ink-muted">
        Verify an archive
      </h3>
      <div className="flex flex-wrap items-center gap-3">
        <label htmlFor={inputId} className="text-sm font-bold">
          Archive (.zip)
        </label>
        <input
          id={inputId}
          type="file"
          accept=".zip,application/zip"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          className="text-sm"
        />
        <Button type="submit" icon={ShieldCheck} disabled={!file} isBusy={verify.isPending}>
          Verify
        </Button>
      </div>
      {verify.isError && (
        <p role="alert" className="text-sm text-state-bad">
          {verify.error.message}
        </p>
      )}
      {result && (
        <div role="status" className="space-y-2">
          <p
            className={`flex items-center gap-2 text-sm font-bold ${result.ok ? 'text-state-ok' : 'text-state-bad'}`}
          >
            {result.ok ? (
              <CheckCircle2 aria-hidden className="size-4" />
            ) : (
              <XCircle aria-hidden className="size-4" />
            )}
            {result.ok
              ? `All ${result.checks.length} checks passed`
              : `${result.checks.filter((c) => !c.ok).length} of ${result.checks.length} checks failed`}
          </p>
          <p className="text-xs text-ink-muted">
            Archive SHA-256 <span className="font-mono break-all">{result.archiveSha256}</span>
          </p>
          <ul className="max-h-72 overflow-auto text-xs">
            {checks.map((check) => (
              <li key={`${check.kind}-${check.file ?? ''}-${check.message}`} className="flex gap-2 py-0.5">
                <span className={`font-bold ${check.ok ? 'text-state-ok' : 'text-state-bad'}`}>
                  {check.ok ? 'Passed' : 'Failed'}
                </span>
                <span className="text-ink-muted">{ARCHIVE_CHECK_KIND_LABELS[check.kind]}</span>
                <span className="break-all">{check.message}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </form>
  );
}
