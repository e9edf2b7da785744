import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import type { ReactNode } from 'react';

export type SortOrder = 'asc' | 'desc';

interface SortableHeaderProps {
  label: ReactNode;
  isActive: boolean;
  order: SortOrder;
  onSort: () => void;
  className?: string;
}

/** A column header button; `aria-sort` sits on the `<th>` as the ARIA table pattern asks. */
export function SortableHeader({ label, isActive, order, onSort, className }: SortableHeaderProps) {
  const Icon = !isActive ? ArrowUpDown : order === 'asc' ? ArrowUp : ArrowDown;
  const ariaSort = isActive ? (order === 'asc' ? 'ascending' : 'descending') : 'none';
  return (
    <th scope="col" aria-sort={ariaSort} className={className}>
      <button
        type="button"
        onClick={onSort}
        className="-mx-1 inline-flex items-center gap-1 rounded px-1 font-bold hover:text-ink"
      >
        {label}
        <Icon aria-hidden className={isActive ? 'size-3.5 text-ink' : 'size-3.5 text-ink-faint'} />
      </button>
    </th>
  );
}
