import { ChevronLeft, ChevronRight } from 'lucide-react';
import { useId } from 'react';
import { Button } from './button';
import { SelectInput } from './inputs';

export const PAGE_SIZES = [10, 20, 50, 100] as const;

interface PaginationProps {
  page: number;
  pageSize: number;
  total: number;
  itemLabel: string;
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
}

export function Pagination({
  page,
  pageSize,
  total,
  itemLabel,
  onPageChange,
  onPageSizeChange,
}: PaginationProps) {
  const sizeId = useId();
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pagination" className="flex items-center justify-between gap-4 text-sm text-ink-muted">
      <p aria-live="polite" className="tabular-nums">
        {total === 0 ? `No ${itemLabel}` : `${first}–${last} of ${total} ${itemLabel}`}
      </p>
      <div className="flex items-center gap-3">
        <label htmlFor={sizeId} className="whitespace-nowrap">
          Rows per page
        </label>
        <SelectInput
          id={sizeId}
          density="compact"
          className="w-20"
          value={pageSize}
          onChange={(event) => onPageSizeChange(Number(event.target.value))}
        >
          {PAGE_SIZES.map((size) => (
            <option key={size} value={size}>
              {size}
            </option>
          ))}
        </SelectInput>
        <span className="whitespace-nowrap tabular-nums">
          Page {Math.min(page, pageCount)} of {pageCount}
        </span>
        <Button
          size="sm"
          icon={ChevronLeft}
          aria-label="Previous page"
          title="Previous page"
          disabled={page <= 1}
          onClick={() => onPageChange(page - 1)}
        />
        <Button
          size="sm"
          icon={ChevronRight}
          aria-label="Next page"
          title="Next page"
          disabled={page >= pageCount}
          onClick={() => onPageChange(page + 1)}
        />
      </div>
    </nav>
  );
}
