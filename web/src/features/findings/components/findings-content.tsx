import {
  CAUSE_CATEGORY_LABELS,
  INCIDENT_CLASS_LABELS,
  type TFindingsContent,
} from '@shared/contracts/findings';
import type { ReactNode } from 'react';
import { EvidenceCitation } from './evidence-citation';

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mt-4">
      <h3 className="text-xs font-bold tracking-wide text-ink-muted uppercase">{title}</h3>
      <div className="mt-1 text-sm">{children}</div>
    </section>
  );
}

const none = <p className="text-ink-muted italic">None.</p>;

/** A frozen findings version, read-only, in the order a report would give it. */
export function FindingsContent({ caseId, content }: { caseId: string; content: TFindingsContent }) {
  return (
    <div>
      <Part title="Incident class">{INCIDENT_CLASS_LABELS[content.incidentClass]}</Part>
      <Part title="Summary">
        <p className="whitespace-pre-line">{content.summary}</p>
      </Part>
      <Part title="Root cause">
        <p>
          <span className="font-bold">{CAUSE_CATEGORY_LABELS[content.rootCause.category]}: </span>
          <span className="whitespace-pre-line">{content.rootCause.text}</span>
        </p>
      </Part>
      <Part title="Contributing factors">
        {content.contributingFactors.length === 0
          ? none
          : content.contributingFactors.map((factor) => (
              <p key={`${factor.category}:${factor.text}`}>
                <span className="font-bold">{CAUSE_CATEGORY_LABELS[factor.category]}: </span>
                {factor.text}
              </p>
            ))}
      </Part>
      <Part title="Evidence">
        {content.evidence.length === 0 ? (
          none
        ) : (
          <ul className="space-y-2">
            {content.evidence.map((item) => (
              <li key={JSON.stringify(item)}>
                <EvidenceCitation caseId={caseId} item={item} />
                {item.note && <p className="text-ink-muted">{item.note}</p>}
              </li>
            ))}
          </ul>
        )}
      </Part>
      <Part title="Corrective actions">
        {content.correctiveActions.length === 0 ? (
          none
        ) : (
          <ul className="list-disc pl-5">
            {content.correctiveActions.map((action) => (
              <li key={`${action.description}:${action.owner}:${action.dueDate}`}>
                {action.description} — <span className="font-bold">{action.owner}</span>, due{' '}
                <span className="tabular-nums">{action.dueDate}</span>
              </li>
            ))}
          </ul>
        )}
      </Part>
    </div>
  );
}
