/** The report's files as the moderator checks them: playable video or the photo, with size and hash. */
export function EvidenceMedia({
  media,
}: {
  media: {
    id: number;
    kind: string;
    url: string;
    contentType: string | null;
    size: number | null;
    sha256: string | null;
    status: string;
  }[];
}) {
  return (
    <section className="space-y-3" aria-labelledby="evidence-heading">
      <h2 id="evidence-heading" className="text-lg font-semibold">
        Evidence
      </h2>
      {media.length === 0 && <p className="text-stone-600">No evidence attached.</p>}
      {media.map((m) => (
        <figure key={m.id} className="rounded-lg border border-stone-200 bg-white p-2">
          {m.kind === "video" ? (
            <video
              src={m.url}
              controls
              preload="metadata"
              className="w-full rounded bg-black"
              data-testid={`video-${m.id}`}
            />
          ) : (
            <img src={m.url} alt={`Evidence photo ${m.id}`} className="w-full rounded" />
          )}
          <figcaption className="mt-1 text-xs text-stone-600">
            {m.contentType} · {m.size ? `${(m.size / 1024 / 1024).toFixed(1)} MB` : "—"} · SHA-256{" "}
            {m.sha256?.slice(0, 12)}… · {m.status.replaceAll("_", " ")}
          </figcaption>
        </figure>
      ))}
    </section>
  );
}
