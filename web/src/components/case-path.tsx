import { CASE_STAGE_LABELS } from '@shared/case-path';
import type { TCasePath } from '@shared/contracts/cases';
import { ROLE_LABELS } from '@shared/human-labels';
import type { Role } from '@shared/roles';
import { formatSiteDate } from '@shared/site-time';
import { Check, Minus } from 'lucide-react';
import { classNames } from '../lib/class-names';
import { useSiteTimeZone } from '../lib/site-time-zone';
import { LocalTime } from './local-time';

type StageState = TCasePath['stages'][number]['state'];

/** Who holds the case, in words: `Safety reviewer`, `Engineer or Safety reviewer`, `Nobody`. */
export function describeHolders(holders: readonly string[]): string {
  if (holders.length === 0) return 'Nobody';
  return holders.map((role) => ROLE_LABELS[role as Role] ?? role).join(' or ');
}

const STATE_WORDS: Record<StageState, string> = {
  done: 'reached',
  now: 'next',
  todo: 'not reached',
  skipped: 'not needed',
};

/** One station on the track; each state has its own shape, so it reads without colour. */
function Station({ state, size }: { state: StageState; size: 'sm' | 'lg' }) {
  const box = size === 'lg' ? 'size-6' : 'size-3';
  if (state === 'done')
    return (
      <span
        className={classNames(box, 'flex items-center justify-center rounded-full bg-chrome-800 text-white')}
      >
        {size === 'lg' && <Check aria-hidden className="size-4" strokeWidth={3} />}
      </span>
    );
  if (state === 'now')
    return (
      <span
        className={classNames(
          box,
          'flex items-center justify-center rounded-full border-2 border-series-replay bg-canvas-raised',
        )}
      >
        <span
          className={classNames('rounded-full bg-series-replay', size === 'lg' ? 'size-2.5' : 'size-1')}
        />
      </span>
    );
  if (state === 'skipped')
    return (
      <span
        className={classNames(
          box,
          'flex items-center justify-center rounded-full border border-dashed border-ink-faint text-ink-faint',
        )}
      >
        {size === 'lg' && <Minus aria-hidden className="size-4" />}
      </span>
    );
  return <span className={classNames(box, 'rounded-full border-2 border-canvas-line bg-canvas-raised')} />;
}

/**
 * The case page's path: Driftcase's six stages as stations on a track, each with the day it was
 * reached, then where the case stands, who holds it and since when.
 */
export function CasePathTrack({ path }: { path: TCasePath }) {
  const zone = useSiteTimeZone();
  return (
    <section
      aria-label="Case path"
      className="rounded-lg border border-canvas-line bg-canvas-raised px-5 py-4"
    >
      <ol className="grid grid-cols-6">
        {path.stages.map((stage, index) => (
          <li
            key={stage.stage}
            className="relative flex flex-col items-center text-center"
            data-state={stage.state}
          >
            {index > 0 && (
              <span
                aria-hidden
                className={classNames(
                  'absolute top-3 right-1/2 h-0.5 w-full -translate-y-1/2',
                  stage.state === 'done' ? 'bg-chrome-800' : 'border-t-2 border-dashed border-canvas-line',
                )}
              />
            )}
            <span className="relative">
              <Station state={stage.state} size="lg" />
            </span>
            <span
              className={classNames(
                'mt-1.5 text-sm',
                stage.state === 'done' || stage.state === 'now' ? 'font-bold text-ink' : 'text-ink-muted',
              )}
            >
              {CASE_STAGE_LABELS[stage.stage]}
            </span>
            <span className="text-xs text-ink-muted tabular-nums">
              {stage.at ? formatSiteDate(stage.at, zone) : STATE_WORDS[stage.state]}
            </span>
          </li>
        ))}
      </ol>
      <p className="mt-4 flex flex-wrap items-baseline gap-x-2 border-t border-canvas-line pt-3 text-sm">
        <span className="font-bold text-ink" data-testid="case-standing">
          {path.summary}
        </span>
        <span aria-hidden className="text-ink-faint">
          ·
        </span>
        <span>
          <span className="text-ink-muted">held by </span>
          <span className="font-bold">{describeHolders(path.holders)}</span>
          <span className="text-ink-muted"> since </span>
          <LocalTime iso={path.since} />
        </span>
        {path.holders.length > 0 && <span className="basis-full text-ink-muted">{path.task}.</span>}
      </p>
    </section>
  );
}

/** The list's path: six small stations, where it stands and who holds it, in one cell. */
export function CasePathCompact({ path }: { path: TCasePath }) {
  const reached = path.stages.filter((stage) => stage.state === 'done').length;
  return (
    <div className="min-w-0">
      <span className="sr-only">
        {reached} of {path.stages.length} stages reached.
      </span>
      <span aria-hidden className="flex items-center gap-0.5">
        {path.stages.map((stage) => (
          <span key={stage.stage} title={`${CASE_STAGE_LABELS[stage.stage]}: ${STATE_WORDS[stage.state]}`}>
            <Station state={stage.state} size="sm" />
          </span>
        ))}
      </span>
      <span className="mt-0.5 block truncate text-sm font-bold" title={path.summary}>
        {path.summary}
      </span>
      <span className="block truncate text-xs text-ink-muted">
        {describeHolders(path.holders)} · since <LocalTime iso={path.since} />
      </span>
    </div>
  );
}
