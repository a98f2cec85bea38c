"use client";

/** Previous / next through the pages of a server-paged list, with "Page n of m" between. */
export function PageStepper({
  label,
  page,
  pageCount,
  onPageChange,
}: {
  /** Accessible name of the navigation, e.g. "Target pages". */
  label: string;
  page: number;
  pageCount: number;
  onPageChange: (page: number) => void;
}) {
  const buttonClass = "rounded border border-void-edge px-2 py-1 disabled:opacity-40";
  return (
    <nav aria-label={label} className="flex items-center gap-3 text-sm">
      <button type="button" className={buttonClass} disabled={page <= 1} onClick={() => onPageChange(page - 1)}>
        Previous
      </button>
      <span>
        Page {page} of {pageCount}
      </span>
      <button type="button" className={buttonClass} disabled={page >= pageCount} onClick={() => onPageChange(page + 1)}>
        Next
      </button>
    </nav>
  );
}
