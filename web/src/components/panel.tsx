import type { ReactNode } from 'react';

/** A titled, raised section of a page; the heading labels the region for assistive technology. */
export function Panel({
  id,
  title,
  children,
  className = '',
}: {
  id: string;
  title: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <section
      aria-labelledby={id}
      className={`rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm ${className}`}
    >
      <h2 id={id} className="mb-3 text-base font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}
