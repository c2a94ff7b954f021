import { Form } from "react-router";
import { buttonClass } from "~/components/ui";

/** Publishing a report's files with the open data after it left the form (a plain form each). */
export function OpenDataFiles({ files }: { files: { id: number; kind: string; is_public: boolean }[] }) {
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-bay-700">
        Files in the open data ({files.filter((f) => f.is_public).length} of {files.length} published)
      </summary>
      <p className="mt-1 text-xs text-stone-600">
        Published files are linked from the open data feed (CC BY 4.0) once the report is accepted. Publish only what
        shows no faces, number plates or customer details.
      </p>
      <ul className="mt-1 space-y-1">
        {files.map((f, i) => (
          <li key={f.id} className="flex flex-wrap items-center justify-between gap-2 rounded bg-bay-50 px-2 py-1">
            <span>
              {f.kind === "video" ? "Video" : "Photo"} {i + 1}: {f.is_public ? "published" : "not published"}
            </span>
            <Form method="post">
              <input type="hidden" name="evidenceId" value={f.id} />
              <input type="hidden" name="publish" value={f.is_public ? "no" : "yes"} />
              <button type="submit" name="intent" value="publish-evidence" className={buttonClass("plain", "sm")}>
                {f.is_public ? "Take it out of the open data" : "Publish with the open data"}
              </button>
            </Form>
          </li>
        ))}
      </ul>
    </details>
  );
}
