import { Button } from './button';

/** Previous / next for a table paged on the server. */
export function Pager({ page, pageCount, onPage }: { page: number; pageCount: number; onPage: (page: number) => void }) {
  const last = Math.max(1, pageCount);
  return (
    <nav aria-label="Pages" className="flex items-center justify-end gap-3">
      <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      <span className="text-sm">
        Page {Math.min(page, last)} of {last}
      </span>
      <Button variant="secondary" disabled={page >= last} onClick={() => onPage(page + 1)}>
        Next
      </Button>
    </nav>
  );
}
