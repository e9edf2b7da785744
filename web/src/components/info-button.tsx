import { paths } from '@web/config/paths';
import { glossaryEntry } from '@web/lib/glossary';
import { Info } from 'lucide-react';
import { useId, useState } from 'react';
import { Link } from 'react-router-dom';

/** A small (i) beside a term: opens its short explanation and source, with a link to the Help page. */
export function InfoButton({ term }: { term: string }) {
  const entry = glossaryEntry(term);
  const [isOpen, setIsOpen] = useState(false);
  const panelId = useId();
  if (!entry) return null;
  return (
    <span className="relative inline-flex">
      <button
        type="button"
        aria-label={`What is ${entry.term}?`}
        title={`What is ${entry.term}?`}
        aria-expanded={isOpen}
        aria-controls={panelId}
        onClick={() => setIsOpen((open) => !open)}
        onKeyDown={(event) => event.key === 'Escape' && setIsOpen(false)}
        className="rounded-full text-ink-muted hover:text-accent focus-visible:ring-2 focus-visible:ring-accent focus-visible:outline-none"
      >
        <Info aria-hidden className="size-3.5" />
      </button>
      {isOpen && (
        <span
          id={panelId}
          role="note"
          aria-label={entry.term}
          className="absolute top-5 left-0 z-30 w-72 rounded-md border border-canvas-line bg-canvas-raised p-3 text-left text-xs font-normal text-ink shadow-lg"
        >
          <span className="block font-bold">{entry.term}</span>
          <span className="mt-1 block">{entry.text}</span>
          <span className="mt-1 block text-ink-muted">Source: {entry.source}</span>
          <Link to={`${paths.help.href()}#${entry.id}`} className="mt-1 block text-accent hover:underline">
            All terms on the Help page
          </Link>
        </span>
      )}
    </span>
  );
}
