// Evidence uploads with Uppy's dashboard: files go from the browser straight to object storage
// through presigned PUT URLs from /api/reports/:id/evidence; each finished upload is then checked
// by /api/evidence/:id/complete (real type from the bytes, size, SHA-256). Browser only.
import "@uppy/core/css/style.min.css";
import "@uppy/dashboard/css/style.min.css";
import { useEffect, useState } from "react";
import type Uppy from "@uppy/core";
import { EVIDENCE_KIND_LABELS, type EvidenceKind } from "~/domain";
import { EVIDENCE_TYPES, MAX_BYTES } from "~/storage/evidence-types";

export interface EvidenceItem {
  id: number;
  kind: EvidenceKind;
  contentType: string | null;
  size: number | null;
  status: string;
  /** Published with the open data (the feed links it). */
  isPublic: boolean;
}

export function EvidenceUploader({ reportId, initial }: { reportId: number | null; initial: EvidenceItem[] }) {
  const [uppy, setUppy] = useState<Uppy | null>(null);
  const [Dashboard, setDashboard] = useState<React.ComponentType<Record<string, unknown>> | null>(null);
  const [items, setItems] = useState<EvidenceItem[]>(initial);
  const [problems, setProblems] = useState<string[]>([]);

  useEffect(() => {
    if (!reportId) return;
    let instance: Uppy | null = null;
    let cancelled = false;
    (async () => {
      const [{ default: UppyCore }, { default: AwsS3 }, { default: DashboardComponent }] = await Promise.all([
        import("@uppy/core"), import("@uppy/aws-s3"), import("@uppy/react/dashboard"),
      ]);
      if (cancelled) return;
      const u = new UppyCore({
        id: `evidence-${reportId}`,
        autoProceed: true,
        restrictions: { allowedFileTypes: [...Object.keys(EVIDENCE_TYPES), ".mov", ".heic"], maxFileSize: MAX_BYTES.video, maxNumberOfFiles: 12 },
      });
      u.use(AwsS3, {
        shouldUseMultipart: false,
        generateObjectKey: (file) => file.id,
        async signRequest(request) {
          if (request.method !== "PUT" || "uploadId" in request) throw new Error("Only single uploads are supported");
          const file = u.getFile(request.key);
          const res = await fetch(`/api/reports/${reportId}/evidence`, {
            method: "POST",
            headers: { "Content-Type": "application/json" },
            body: JSON.stringify({ type: file.type, size: file.size }),
          });
          const body = await res.json().catch(() => ({}));
          if (!res.ok) throw new Error(body.error ?? "The upload was refused");
          u.setFileMeta(file.id, { evidenceId: body.evidenceId });
          return { url: body.url, key: body.key, headers: body.headers };
        },
      });
      u.on("upload-success", async (file) => {
        if (!file) return;
        const evidenceId = u.getFile(file.id).meta.evidenceId;
        // The server's own message (e.g. storage out of reach: 503, the draft kept); a network
        // failure or an answer that is not JSON gets a plain one.
        const res = await fetch(`/api/evidence/${evidenceId}/complete`, { method: "POST" }).catch(() => null);
        const body = res ? await res.json().catch(() => ({})) : {};
        if (!res?.ok) {
          const message: string = body.error ?? "The file could not be checked. It is kept on your device: try again in a few minutes.";
          setProblems((p) => [...p, `${file.name}: ${message}`]);
          u.info(message, "error", 8000);
          return;
        }
        setItems((list) => [...list, { id: body.id, kind: body.kind, contentType: body.contentType, size: body.size, status: "uploaded", isPublic: false }]);
      });
      u.on("upload-error", (file, error) => setProblems((p) => [...p, `${file?.name ?? "A file"}: ${error.message}`]));
      instance = u;
      setUppy(u);
      setDashboard(() => DashboardComponent as unknown as React.ComponentType<Record<string, unknown>>);
    })();
    return () => {
      cancelled = true;
      instance?.destroy();
    };
  }, [reportId]);

  return (
    <div className="space-y-3" data-testid="evidence">
      {items.length > 0 && (
        <p className="text-xs text-stone-600">
          Files you publish are linked from Bayproof's open data (CC BY 4.0) once the report is accepted. Publish only what shows
          no faces, number plates or customer details.
        </p>
      )}
      {items.length > 0 && (
        <ul className="space-y-1 text-sm" aria-label="Attached evidence">
          {items.map((e) => (
            <li key={e.id} className="flex flex-wrap items-center justify-between gap-2 rounded bg-bay-100 px-3 py-2">
              <span>✓ {EVIDENCE_KIND_LABELS[e.kind]} ({e.contentType}, {e.size ? `${(e.size / 1024 / 1024).toFixed(1)} MB` : "size unknown"}) — checked</span>
              <PublishToggle item={e} onChange={(isPublic) => setItems((list) => list.map((x) => (x.id === e.id ? { ...x, isPublic } : x)))} onProblem={(p) => setProblems((ps) => [...ps, p])} />
            </li>
          ))}
        </ul>
      )}
      {problems.map((p) => <p key={p} role="alert" className="text-sm text-red-700">{p}</p>)}
      {!reportId ? (
        <p className="rounded border border-dashed border-stone-300 p-4 text-sm text-stone-600">
          Pick the tool and the job first: the draft is saved then, and you can add video of the job and a photo of the gauge.
        </p>
      ) : uppy && Dashboard ? (
        <Dashboard uppy={uppy} width="100%" height={320} proudlyDisplayPoweredByUppy={false}
          note="Video (mp4, mov, webm) up to 500 MB, photos (jpeg, png, heic) up to 25 MB. Show the job, the tool and the gauge." />
      ) : (
        <p className="text-sm text-stone-600">Loading the uploader…</p>
      )}
    </div>
  );
}

/**
 * Whether the file goes out with the open data once the report is accepted (CC BY 4.0). Off by
 * default: faces, plates and shop names may be in the picture.
 */
function PublishToggle({ item, onChange, onProblem }: { item: EvidenceItem; onChange: (isPublic: boolean) => void; onProblem: (message: string) => void }) {
  const [busy, setBusy] = useState(false);
  return (
    <label className="flex items-center gap-2 text-sm">
      <input
        type="checkbox"
        className="h-5 w-5"
        checked={item.isPublic}
        disabled={busy}
        onChange={async (event) => {
          const wanted = event.currentTarget.checked;
          // Shown at once (and disabled until the server answers), put back if the server refuses.
          onChange(wanted);
          setBusy(true);
          try {
            const res = await fetch(`/api/evidence/${item.id}/publish`, {
              method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ public: wanted }),
            }).catch(() => null);
            if (!res?.ok) {
              onChange(!wanted);
              const body = res ? await res.json().catch(() => ({})) : {};
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
