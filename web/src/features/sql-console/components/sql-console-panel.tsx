import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { SelectInput, TextArea } from '@web/components/inputs';
import { ErrorState } from '@web/components/states';
import { LoaderCircle, Play, Save } from 'lucide-react';
import { useId, useMemo, useState } from 'react';
import { useDuckDbSession } from '../hooks/use-duckdb-session';
import { useQueryRunner } from '../hooks/use-query-runner';
import { startersFor } from '../lib/starter-queries';
import { QueryResultsTable } from './query-results-table';
import { SaveQueryDialog } from './save-query-dialog';
import { SavedQueryList } from './saved-query-list';

interface SqlConsolePanelProps {
  caseId: string;
  bundleId: string;
  /** The bundle's table names (`TBundleRecord.tables[].name`). */
  tables: readonly string[];
  /** Only investigators may save queries to the case; others can still run and download them. */
  canSave?: boolean;
}

/** SQL over the bundle's tables, run in the browser with DuckDB-wasm; results can be saved as evidence. */
export function SqlConsolePanel({ caseId, bundleId, tables, canSave = true }: SqlConsolePanelProps) {
  const session = useDuckDbSession(bundleId, tables);
  const ready = session.status === 'ready' ? session.session : undefined;
  const { state, run } = useQueryRunner(ready);
  const starters = useMemo(() => startersFor(tables), [tables]);
  const [sql, setSql] = useState(
    () => starters[0]?.sql ?? `SELECT * FROM ${tables[0] ?? 'odometry'} LIMIT 100;`,
  );
  const [isSaving, setIsSaving] = useState(false);
  const editorId = useId();
  const starterId = useId();
  const helpId = useId();

  if (session.status === 'error')
    return <ErrorState error={session.error} title="Could not start the SQL console" />;

  return (
    <section aria-label="SQL console" className="flex flex-col gap-3">
      {session.status === 'loading' && (
        <p role="status" className="flex items-center gap-2 text-sm text-ink-muted">
          <LoaderCircle aria-hidden className="size-4 animate-spin" />
          {session.step}…
        </p>
      )}
      <div className="flex flex-wrap items-end gap-2">
        <div>
          <label htmlFor={starterId} className="block text-sm font-bold text-ink">
            Starter query
          </label>
          <SelectInput
            id={starterId}
            className="mt-1 w-80"
            value=""
            onChange={(event) => {
              const starter = starters.find((s) => s.id === event.target.value);
              if (starter) setSql(starter.sql);
            }}
          >
            <option value="">Choose a starter query…</option>
            {starters.map((starter) => (
              <option key={starter.id} value={starter.id}>
                {starter.label}
              </option>
            ))}
          </SelectInput>
        </div>
        <p className="text-xs text-ink-muted">Tables: {tables.join(', ') || 'none'}</p>
      </div>
      <form
        onSubmit={(event) => {
          event.preventDefault();
          void run(sql);
        }}
      >
        <label htmlFor={editorId} className="block text-sm font-bold text-ink">
          SQL
        </label>
        <p id={helpId} className="text-xs text-ink-muted">
          DuckDB SQL over this bundle's tables. Ctrl+Enter (⌘+Enter on a Mac) runs it.
        </p>
        <TextArea
          id={editorId}
          aria-describedby={helpId}
          spellCheck={false}
          rows={9}
          className="mt-1 font-mono text-xs"
          value={sql}
          onChange={(event) => setSql(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter' && (event.ctrlKey || event.metaKey)) {
              event.preventDefault();
              void run(sql);
            }
          }}
        />
        <div className="mt-2 flex gap-2">
          <Button
            type="submit"
            variant="primary"
            icon={Play}
            disabled={!ready}
            isBusy={state.status === 'running'}
          >
            Run query
          </Button>
          {canSave && (
            <Button
              icon={Save}
              disabled={state.status !== 'done' || !state.result.columns.length}
              onClick={() => setIsSaving(true)}
            >
              Save to case as evidence
            </Button>
          )}
        </div>
      </form>
      {state.status === 'error' && (
        <Alert title="DuckDB could not run this query">
          {/* DuckDB points at the error with a caret on its own line; keep the line breaks. */}
          <pre className="whitespace-pre-wrap font-mono text-xs">{state.message}</pre>
        </Alert>
      )}
      {state.status === 'done' &&
        (state.result.columns.length ? (
          <QueryResultsTable
            result={state.result}
            elapsedMs={state.elapsedMs}
            csvFileName={`query-${bundleId.slice(0, 8)}.csv`}
          />
        ) : (
          <p className="text-sm text-ink-muted">The statement ran and returned no columns.</p>
        ))}
      {state.status === 'done' && (
        <SaveQueryDialog
          isOpen={isSaving}
          caseId={caseId}
          bundleId={bundleId}
          sql={state.sql}
          result={state.result}
          onClose={() => setIsSaving(false)}
        />
      )}
      <section aria-labelledby={`${editorId}-saved`}>
        <h3 id={`${editorId}-saved`} className="text-sm font-bold text-ink">
          Saved queries of this case
        </h3>
        <SavedQueryList caseId={caseId} bundleId={bundleId} onLoad={(query) => setSql(query.sql)} />
      </section>
    </section>
  );
}
