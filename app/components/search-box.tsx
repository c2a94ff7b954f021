import { useEffect, useState } from "react";
import { Form, Link, useFetcher } from "react-router";

/** The header's search: a plain GET form to /search, with suggestions from /api/search as you type. */
export function SearchBox() {
  const fetcher = useFetcher<{ hits: { id: string; title: string; url: string; kind: string; detail?: string }[] }>();
  // fetcher.load keeps its identity across renders (the fetcher object does not).
  const { load } = fetcher;
  const [q, setQ] = useState("");
  const [open, setOpen] = useState(false);
  useEffect(() => {
    if (q.trim().length < 2) return;
    const t = setTimeout(() => void load(`/api/search?q=${encodeURIComponent(q.trim())}`), 150);
    return () => clearTimeout(t);
  }, [q, load]);
  const hits = open && q.trim().length >= 2 ? (fetcher.data?.hits ?? []) : [];
  return (
    <Form
      method="get"
      action="/search"
      role="search"
      aria-label="Site search"
      className="relative w-full"
      onSubmit={() => setOpen(false)}
    >
      <input
        name="q"
        value={q}
        onChange={(e) => {
          setQ(e.target.value);
          setOpen(true);
        }}
        onBlur={(e) => {
          if (!e.currentTarget.form?.contains(e.relatedTarget)) setOpen(false);
        }}
        aria-label="Search tools and reports"
        placeholder="Search tools and reports"
        autoComplete="off"
        className="min-h-11 w-full rounded bg-bay-700 px-3 py-2 text-sm text-white placeholder:text-bay-100"
      />
      {hits.length > 0 && (
        <ul
          className="absolute right-0 z-20 mt-1 w-full min-w-72 rounded border border-stone-300 bg-white text-stone-900 shadow-lg"
          data-testid="suggestions"
          // Keeps the focus in the box while a suggestion is pressed, so the list stays until the click lands.
          onMouseDown={(e) => e.preventDefault()}
        >
          {hits.map((h) => (
            <li key={h.id}>
              <Link to={h.url} onClick={() => setOpen(false)} className="block px-3 py-2 text-sm hover:bg-bay-50">
                <span className="font-semibold">{h.title}</span>{" "}
                <span className="text-xs text-stone-500">{h.kind === "model" ? "tool" : h.detail}</span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Form>
  );
}
