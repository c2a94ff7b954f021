import { Link } from "react-router";
import { buttonClass } from "./ui";

export function Pager({ page, pages, basePath }: { page: number; pages: number; basePath: string }) {
  if (pages <= 1) return null;
  const href = (p: number) => `${basePath}?page=${p}`;
  return (
    <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-2 text-sm">
      {page > 1 ? (
        <Link className={buttonClass("plain", "sm")} to={href(page - 1)}>
          ← Newer
        </Link>
      ) : (
        <span />
      )}
      <span className="text-stone-600">
        Page {page} of {pages}
      </span>
      {page < pages ? (
        <Link className={buttonClass("plain", "sm")} to={href(page + 1)}>
          Older →
        </Link>
      ) : (
        <span />
      )}
    </nav>
  );
}
