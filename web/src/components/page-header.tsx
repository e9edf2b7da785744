import type { ReactNode } from 'react';

interface PageHeaderProps {
  title: ReactNode;
  /** A line above the title, e.g. the case reference. */
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

/** The page's one `<h1>`; the app shell's title bar repeats it only as breadcrumbs. */
export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <div className="mb-5 flex items-end justify-between gap-4">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 text-sm text-ink-muted">{eyebrow}</div>}
        <h1 className="truncate text-xl font-bold text-ink">{title}</h1>
        {description && <p className="mt-1 text-sm text-ink-muted">{description}</p>}
      </div>
      {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
    </div>
  );
}
