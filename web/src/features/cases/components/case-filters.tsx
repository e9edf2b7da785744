import { CASE_STATUS_LABELS, CASE_STATUSES, type TCaseStatus, type TSeverity } from '@shared/contracts/cases';
import { Button } from '@web/components/button';
import { DebouncedTextInput } from '@web/components/debounced-text-input';
import { FormField } from '@web/components/form-field';
import { SelectInput } from '@web/components/inputs';
import { SeverityOptions } from '@web/components/severity-options';
import { Search, X } from 'lucide-react';
import type { CaseListParams } from '../hooks/case-list-params';

interface CaseFiltersProps {
  params: CaseListParams;
  onChange: (changes: Partial<CaseListParams>) => void;
}

export function CaseFilters({ params, onChange }: CaseFiltersProps) {
  const hasFilters = Boolean(params.q || params.status || params.severity || params.site);
  return (
    <search aria-label="Filter cases" className="flex flex-wrap items-end gap-3">
      <FormField label="Search" className="min-w-40 flex-1">
        {(control) => (
          <div className="relative">
            <Search aria-hidden className="pointer-events-none absolute top-3 left-3 size-4 text-ink-faint" />
            <DebouncedTextInput
              {...control}
              type="search"
              className="pl-9"
              placeholder="Reference, title, robot…"
              value={params.q ?? ''}
              onValueChange={(q) => onChange({ q: q || undefined })}
            />
          </div>
        )}
      </FormField>
      <FormField label="Status" className="w-40 xl:w-44">
        {(control) => (
          <SelectInput
            {...control}
            value={params.status ?? ''}
            onChange={(event) =>
              onChange({ status: (event.target.value || undefined) as TCaseStatus | undefined })
            }
          >
            <option value="">Any status</option>
            {CASE_STATUSES.map((status) => (
              <option key={status} value={status}>
                {CASE_STATUS_LABELS[status]}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      <FormField label="Severity" className="w-36">
        {(control) => (
          <SelectInput
            {...control}
            value={params.severity ?? ''}
            onChange={(event) =>
              onChange({ severity: (event.target.value || undefined) as TSeverity | undefined })
            }
          >
            <SeverityOptions emptyLabel="Any severity" />
          </SelectInput>
        )}
      </FormField>
      <FormField label="Site" className="w-32 xl:w-44">
        {(control) => (
          <DebouncedTextInput
            {...control}
            placeholder="Any site"
            value={params.site ?? ''}
            onValueChange={(site) => onChange({ site: site || undefined })}
          />
        )}
      </FormField>
      <Button
        icon={X}
        variant="ghost"
        title="Clear all filters"
        disabled={!hasFilters}
        onClick={() => onChange({ q: undefined, status: undefined, severity: undefined, site: undefined })}
      >
        Clear
      </Button>
    </search>
  );
}
