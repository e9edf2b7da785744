import type { FilterConfig } from '@shared/bundle/types';
import { RESAMPLING_METHODS } from '@shared/bundle/types';
import type { TReplay } from '@shared/contracts/replays';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextInput } from '@web/components/inputs';
import { isApiError } from '@web/lib/api-client';
import { Play, RotateCcw } from 'lucide-react';
import { type FormEvent, useMemo, useState } from 'react';
import { useStartReplay } from '../api/start-replay';
import {
  DEFAULT_LIMITS,
  defaultsFrom,
  limitHints,
  type ReplayFormValues,
  type ReplayLimits,
  toStartRequest,
} from './replay-form-values';

interface ReplayLauncherProps {
  bundleId: string;
  /** The manifest's filter block (mount the form once it has loaded). */
  defaults: FilterConfig;
  /** What this bundle allows (scanner beams, particle limit), shown and checked beside the fields. */
  limits?: ReplayLimits;
  onStarted: (replay: TReplay) => void;
}

const ALPHA_NAMES = ['α1', 'α2', 'α3', 'α4'] as const;

const NUMBER_FIELDS = [
  { key: 'particles', label: 'Particles', hint: 'count' },
  { key: 'seed', label: 'Seed', hint: 'random stream; same seed, same replay' },
  { key: 'resampling_threshold', label: 'Resampling threshold', hint: 'fraction of N, 0–1' },
  { key: 'beams_used', label: 'Beams used', hint: 'laser beams per scan' },
] as const;

/** Starts a replay with the manifest's settings or with overrides checked by the shared schema. */
export function ReplayLauncher({
  bundleId,
  defaults,
  limits = DEFAULT_LIMITS,
  onStarted,
}: ReplayLauncherProps) {
  const hints = limitHints(limits);
  const initial = useMemo(() => defaultsFrom(defaults), [defaults]);
  const [values, setValues] = useState<ReplayFormValues>(initial);
  const [issues, setIssues] = useState<Record<string, string>>({});
  const start = useStartReplay(bundleId);
  const set = <K extends keyof ReplayFormValues>(key: K, value: ReplayFormValues[K]) =>
    setValues((current) => ({ ...current, [key]: value }));

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const request = toStartRequest(values, initial, limits);
    if (!request.ok) {
      setIssues(request.issues);
      return;
    }
    setIssues({});
    start.mutate(request.body, {
      onSuccess: onStarted,
      // The server's field issues (same paths, e.g. `overrides.beams_used`) go beside their fields.
      onError: (error) => {
        if (!isApiError(error)) return;
        setIssues(Object.fromEntries(error.fieldIssues.map((issue) => [issue.path, issue.message])));
      },
    });
  };

  return (
    <form onSubmit={onSubmit} aria-label="Start a replay" noValidate className="space-y-3">
      <p className="text-xs text-ink-muted">
        Fields start at the bundle manifest's settings; change any to run a what-if replay.
      </p>
      <FormField label="Label" isOptional error={issues.label}>
        {(control) => (
          <TextInput
            {...control}
            value={values.label}
            onChange={(e) => set('label', e.target.value)}
            placeholder="e.g. more particles"
          />
        )}
      </FormField>
      <div className="grid grid-cols-2 gap-3">
        {NUMBER_FIELDS.map((field) => (
          <FormField
            key={field.key}
            label={field.label}
            hint={field.key === 'particles' || field.key === 'beams_used' ? hints[field.key] : field.hint}
            error={issues[`overrides.${field.key}`]}
          >
            {(control) => (
              <TextInput
                {...control}
                inputMode="decimal"
                value={values[field.key]}
                onChange={(e) => set(field.key, e.target.value)}
              />
            )}
          </FormField>
        ))}
      </div>
      <FormField label="Resampling method" error={issues['overrides.resampling_method']}>
        {(control) => (
          <SelectInput
            {...control}
            value={values.resampling_method}
            onChange={(e) => set('resampling_method', e.target.value)}
          >
            {RESAMPLING_METHODS.map((method) => (
              <option key={method} value={method}>
                {method}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      <fieldset>
        <legend className="text-sm font-bold">Motion noise α1–α4</legend>
        <p className="text-xs text-ink-muted">odometry motion model variance coefficients</p>
        <div className="mt-1 grid grid-cols-4 gap-2">
          {ALPHA_NAMES.map((name, i) => (
            <FormField
              key={name}
              label={name}
              error={
                issues[`overrides.motion_alpha.${i}`] ??
                (i === 0 ? issues['overrides.motion_alpha'] : undefined)
              }
            >
              {(control) => (
                <TextInput
                  {...control}
                  inputMode="decimal"
                  value={values.motion_alpha[i]}
                  onChange={(e) => {
                    const next = [...values.motion_alpha] as ReplayFormValues['motion_alpha'];
                    next[i] = e.target.value;
                    set('motion_alpha', next);
                  }}
                />
              )}
            </FormField>
          ))}
        </div>
      </fieldset>
      <div className="flex gap-4 text-sm">
        <label className="flex items-center gap-1.5">
          <input
            type="checkbox"
            checked={values.recovery}
            onChange={(e) => set('recovery', e.target.checked)}
          />
          Recovery (random particles when lost)
        </label>
        <label className="flex items-center gap-1.5">
          <input type="checkbox" checked={values.kld} onChange={(e) => set('kld', e.target.checked)} />
          Adaptive particle count (KLD)
        </label>
      </div>
      {start.isError && <Alert title="The replay did not start">{start.error.message}</Alert>}
      <div className="flex gap-2">
        <Button type="submit" variant="primary" icon={Play} isBusy={start.isPending}>
          Start replay
        </Button>
        <Button
          icon={RotateCcw}
          onClick={() => {
            setValues(initial);
            setIssues({});
          }}
        >
          Reset to manifest
        </Button>
      </div>
    </form>
  );
}
