/**
 * One evidence file as it plays or shows: the video with its controls, or the photo. `label` is the
 * photo's alt text, `videoLabel` the video's accessible name where one is given.
 */
export function EvidenceFile({
  kind,
  url,
  label,
  videoLabel,
  testId,
  lazy = false,
}: {
  kind: string;
  url: string;
  label: string;
  videoLabel?: string;
  testId?: string;
  lazy?: boolean;
}) {
  return kind === "video" ? (
    <video
      src={url}
      controls
      preload="metadata"
      className="w-full rounded bg-black"
      aria-label={videoLabel}
      data-testid={testId}
    />
  ) : (
    <img src={url} alt={label} loading={lazy ? "lazy" : undefined} className="w-full rounded" />
  );
}

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
          <EvidenceFile kind={m.kind} url={m.url} label={`Evidence photo ${m.id}`} testId={`video-${m.id}`} />
          <figcaption className="mt-1 text-xs text-stone-600">
            {m.contentType} · {m.size ? `${(m.size / 1024 / 1024).toFixed(1)} MB` : "—"} · SHA-256{" "}
            {m.sha256?.slice(0, 12)}… · {m.status.replaceAll("_", " ")}
          </figcaption>
        </figure>
      ))}
    </section>
  );
}
