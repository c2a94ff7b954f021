// The report's evidence: what is attached, what is on its way (with progress and a retry), and two
// ways to add more — the phone's camera (capture) or a file already on the device.
import { useState } from "react";
import { EVIDENCE_KIND_LABELS } from "~/domain";
import { EVIDENCE_TYPES, isEvidenceType } from "~/storage/evidence-types";
import { buttonClass, cx } from "~/components/ui";
import { type EvidenceItem, type Upload, useEvidenceUploads } from "./use-evidence-uploads";

export type { EvidenceItem };

const ACCEPT = "video/*,image/*,.mov,.heic";

export function EvidenceUploader({ reportId, initial }: { reportId: number | null; initial: EvidenceItem[] }) {
  const [items, setItems] = useState<EvidenceItem[]>(initial);
  const [publishProblems, setPublishProblems] = useState<string[]>([]);
  const uploads = useEvidenceUploads(reportId, (item) => setItems((list) => [...list, item]));
  const problems = [...uploads.problems, ...publishProblems];

  return (
    <div className="space-y-3" data-testid="evidence">
      <div className="rounded border-l-4 border-bay-600 bg-bay-50 p-3 text-sm">
        <p className="font-semibold">What a moderator needs to see</p>
        <ul className="mt-1 list-disc space-y-1 pl-5">
          <li>The job: the tool on the part, from start to result.</li>
          <li>
            The gauge at the tool inlet <em>while the tool runs</em> — a few seconds of video, or a photo at full
            trigger.
          </li>
        </ul>
        <p className="mt-1 text-stone-700">
          Have a helper hold the phone, or set it down first: keep hands and phone clear of the bit, with eye and
          hearing protection on.
        </p>
      </div>

      {items.length > 0 && (
        <>
          <ul className="space-y-2 text-sm" aria-label="Attached evidence">
            {items.map((e) => (
              <li
                key={e.id}
                className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1 rounded border border-stone-200 bg-white px-3 py-2"
              >
                <span>
                  <span className="font-semibold">{EVIDENCE_KIND_LABELS[e.kind]}</span> · {fileType(e.contentType)} ·{" "}
                  {megabytes(e.size)}
                  <span className="ml-2 text-bay-700">received</span>
                </span>
                <PublishToggle
                  item={e}
                  onChange={(isPublic) => setItems((list) => list.map((x) => (x.id === e.id ? { ...x, isPublic } : x)))}
                  onProblem={(p) => setPublishProblems((ps) => [...ps, p])}
                />
              </li>
            ))}
          </ul>
          <p className="text-xs text-stone-600">
            Files you publish are linked from Bayproof's open data (CC BY 4.0) once the report is accepted. Publish only
            what shows no faces, number plates or customer details.
          </p>
        </>
      )}

      {uploads.uploads.length > 0 && (
        <ul className="space-y-2 text-sm" aria-label="Files on their way">
          {uploads.uploads.map((u) => (
            <UploadRow key={u.id} upload={u} onRetry={() => uploads.retry(u)} onRemove={() => uploads.remove(u)} />
          ))}
        </ul>
      )}

      {problems.map((p, i) => (
        <p key={i} role="alert" className="text-sm text-red-700">
          {p}
        </p>
      ))}

      {!reportId ? (
        <p className="rounded border border-dashed border-stone-300 p-4 text-sm text-stone-600">
          Pick the tool and the job first: the draft is saved then, and you can add video of the job and a photo of the
          gauge.
        </p>
      ) : (
        <div className="space-y-2">
          <div className="flex flex-col gap-2 sm:flex-row">
            {/* On a phone this opens the camera straight away; a desktop has no use for it. */}
            <FileButton
              label="Film or photograph now"
              capture
              variant="primary"
              className="pointer-coarse:flex hidden"
              disabled={!uploads.ready}
              onFiles={uploads.add}
            />
            <FileButton label="Choose a file" variant="secondary" disabled={!uploads.ready} onFiles={uploads.add} />
          </div>
          <p className="text-xs text-stone-600">
            Video (mp4, mov, webm) up to 500 MB, photos (jpeg, png, heic) up to 25 MB.
          </p>
        </div>
      )}
    </div>
  );
}

/** A file input dressed as one of our buttons; the input itself stays focusable for the keyboard. */
function FileButton({
  label,
  capture,
  variant,
  className,
  disabled,
  onFiles,
}: {
  label: string;
  capture?: boolean;
  variant: "primary" | "secondary";
  className?: string;
  disabled: boolean;
  onFiles: (files: FileList) => void;
}) {
  return (
    <label
      className={cx(
        buttonClass(variant, "md"),
        "min-h-12 flex-1 cursor-pointer items-center justify-center text-center focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-bay-700",
        className ?? "flex",
        disabled && "opacity-60",
      )}
    >
      <input
        type="file"
        accept={ACCEPT}
        multiple={!capture}
        capture={capture ? "environment" : undefined}
        disabled={disabled}
        className="sr-only"
        onChange={(event) => {
          if (event.currentTarget.files?.length) onFiles(event.currentTarget.files);
          event.currentTarget.value = "";
        }}
      />
      {label}
    </label>
  );
}

function UploadRow({ upload, onRetry, onRemove }: { upload: Upload; onRetry: () => void; onRemove: () => void }) {
  const percent = Math.round(upload.sent * 100);
  return (
    <li className="rounded border border-stone-200 bg-white px-3 py-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <span className="min-w-0 truncate font-semibold">{upload.name}</span>
        <span className="text-stone-700" role="status">
          {upload.stage === "sending"
            ? `Sending… ${percent} %`
            : upload.stage === "checking"
              ? "Checking the file…"
              : "Not sent"}
        </span>
      </div>
      {upload.stage !== "failed" && (
        <progress
          className="mt-2 h-2 w-full accent-bay-700"
          max={100}
          value={upload.stage === "checking" ? undefined : percent}
          aria-label={`${upload.name}: sent`}
        />
      )}
      {upload.stage === "failed" && (
        <div className="mt-1 space-y-2">
          <p className="text-red-700">{upload.problem}</p>
          <div className="flex gap-2">
            <button type="button" onClick={onRetry} className={buttonClass("secondary", "md", "min-h-11")}>
              Try again
            </button>
            <button type="button" onClick={onRemove} className={buttonClass("plain", "md", "min-h-11")}>
              Remove
            </button>
          </div>
        </div>
      )}
    </li>
  );
}

const fileType = (contentType: string | null) =>
  contentType && isEvidenceType(contentType)
    ? EVIDENCE_TYPES[contentType].ext[0].toUpperCase()
    : (contentType ?? "type unknown");
const megabytes = (size: number | null) =>
  !size
    ? "size unknown"
    : size < 1024 * 1024
      ? `${Math.max(1, Math.round(size / 1024))} kB`
      : `${(size / 1024 / 1024).toFixed(1)} MB`;

/**
 * Whether the file goes out with the open data once the report is accepted (CC BY 4.0). Off by
 * default: faces, plates and shop names may be in the picture.
 */
function PublishToggle({
  item,
  onChange,
  onProblem,
}: {
  item: EvidenceItem;
  onChange: (isPublic: boolean) => void;
  onProblem: (message: string) => void;
}) {
  const [busy, setBusy] = useState(false);
  return (
    <label className="flex min-h-11 cursor-pointer items-center gap-2 text-sm">
      <input
        type="checkbox"
        className="h-6 w-6 accent-bay-700"
        checked={item.isPublic}
        disabled={busy}
        onChange={async (event) => {
          const wanted = event.currentTarget.checked;
          // Shown at once (and disabled until the server answers), put back if the server refuses.
          onChange(wanted);
          setBusy(true);
          try {
            const res = await fetch(`/api/evidence/${item.id}/publish`, {
              method: "POST",
              headers: { "Content-Type": "application/json" },
              body: JSON.stringify({ public: wanted }),
            }).catch(() => null);
            if (!res?.ok) {
              onChange(!wanted);
              const body = (res ? await res.json().catch(() => ({})) : {}) as { error?: string };
              onProblem(body.error ?? "Could not change whether the file is published");
            }
          } finally {
            setBusy(false);
          }
        }}
      />
      Publish with the open data
    </label>
  );
}
