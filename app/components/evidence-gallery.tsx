// Videos and photos reporters published with the open data, each linked to the report it belongs to.
import { Link } from "react-router";
import type { PublishedFile } from "~/reports/public.server";

export function EvidenceGallery({
  files,
  title = "From the bay: published videos and photos",
  showReportLinks = true,
}: {
  files: PublishedFile[];
  title?: string;
  showReportLinks?: boolean;
}) {
  if (files.length === 0) return null;
  return (
    <section aria-labelledby="gallery-heading" className="space-y-2">
      <h2 id="gallery-heading" className="text-lg font-semibold">
        {title}
      </h2>
      <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" data-testid="evidence-gallery">
        {files.map((f) => {
          const what = `${f.kind === "video" ? "Video" : "Photo"} from report ${f.reportId} (${f.jobName})`;
          return (
            <li key={f.id}>
              <figure className="rounded-lg border border-stone-200 bg-white p-2">
                {f.kind === "video" ? (
                  <video
                    src={f.url}
                    controls
                    preload="metadata"
                    className="w-full rounded bg-black"
                    aria-label={what}
                  />
                ) : (
                  <img src={f.url} alt={what} loading="lazy" className="w-full rounded" />
                )}
                <figcaption className="mt-1 text-xs text-stone-600">
                  {showReportLinks ? (
                    <Link to={`/reports/${f.reportId}`} className="text-bay-700 underline">
                      {what}
                    </Link>
                  ) : (
                    what
                  )}
                </figcaption>
              </figure>
            </li>
          );
        })}
      </ul>
      <p className="text-xs text-stone-600">
        Published by their reporters with the open data; each belongs to an accepted report, and its page gives the
        figures the reporter gave.
      </p>
    </section>
  );
}
