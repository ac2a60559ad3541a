import { ButtonLink } from "~/components/ui";

/** Newer / older links around "Page n of m"; an empty cell keeps the middle in place at either end. */
export function Pager({
  page,
  pageCount,
  hrefFor,
}: {
  page: number;
  pageCount: number;
  hrefFor: (page: number) => string;
}) {
  return (
    <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-3">
      {page > 1 ? (
        <ButtonLink to={hrefFor(page - 1)} variant="secondary" size="sm" rel="prev">
          ← Newer
        </ButtonLink>
      ) : (
        <span />
      )}
      <p className="num text-sm text-night-600">
        Page {page} of {pageCount}
      </p>
      {page < pageCount ? (
        <ButtonLink to={hrefFor(page + 1)} variant="secondary" size="sm" rel="next">
          Older →
        </ButtonLink>
      ) : (
        <span />
      )}
    </nav>
  );
}
