// Evidence uploads in the browser, with Uppy as the engine and no Uppy interface: files go straight
// to object storage through presigned PUT URLs from /api/reports/:id/evidence, and each finished
// upload is checked by /api/evidence/:id/complete (real type from the bytes, size, SHA-256).
// The hook keeps one entry per file (sending, checking, failed) for the form to show, with retry.
import type Uppy from "@uppy/core";
import { useCallback, useEffect, useRef, useState } from "react";
import type { EvidenceKind } from "~/domain";
import { EVIDENCE_TYPES, isEvidenceType, MAX_BYTES } from "~/storage/evidence-types";

/** A file on the report, as the server checked it. */
export interface EvidenceItem {
  id: number;
  kind: EvidenceKind;
  contentType: string | null;
  size: number | null;
  status: string;
  /** Published with the open data (the feed links it). */
  isPublic: boolean;
}

/** A file on its way: sent to storage, then checked by the server. */
export interface Upload {
  id: string;
  name: string;
  /** 0–1 of the bytes sent. */
  sent: number;
  stage: "sending" | "checking" | "failed";
  /** What went wrong, in our words or the server's. */
  problem?: string;
  /** Set once storage has the file: a retry then repeats only the check. */
  evidenceId?: number;
}

/** Extensions phones give files whose type the browser may not know. */
const EXTRA_EXTENSIONS: Record<string, EvidenceKind> = { mov: "video", heic: "photo", heif: "photo", m4v: "video" };

/** What kind of evidence a picked file would be, or why it cannot be. */
export function screenFile(file: {
  name: string;
  type: string;
  size: number;
}): { kind: EvidenceKind } | { problem: string } {
  const ext = file.name.split(".").pop()?.toLowerCase() ?? "";
  const kind = isEvidenceType(file.type) ? EVIDENCE_TYPES[file.type].kind : EXTRA_EXTENSIONS[ext];
  if (!kind)
    return { problem: `${file.name}: only video (mp4, mov, webm) and photos (jpeg, png, heic) can be attached.` };
  if (file.size > MAX_BYTES[kind]) {
    return {
      problem: `${file.name}: ${kind === "video" ? "a video may be up to 500 MB" : "a photo may be up to 25 MB"}. Trim it, or film a shorter clip.`,
    };
  }
  return { kind };
}

type Meta = { evidenceId?: number };

async function complete(
  evidenceId: number,
): Promise<{ ok: true; item: EvidenceItem } | { ok: false; problem: string }> {
  const res = await fetch(`/api/evidence/${evidenceId}/complete`, { method: "POST" }).catch(() => null);
  const body = (res ? await res.json().catch(() => ({})) : {}) as Record<string, unknown>;
  if (!res?.ok) {
    // The server's own message (e.g. storage out of reach: 503, the draft kept); a network
    // failure or an answer that is not JSON gets a plain one.
    const problem =
      typeof body.error === "string"
        ? body.error
        : "The file could not be checked. It is kept on your device: try again in a few minutes.";
    return { ok: false, problem };
  }
  return {
    ok: true,
    item: {
      id: Number(body.id),
      kind: body.kind as EvidenceKind,
      contentType: typeof body.contentType === "string" ? body.contentType : null,
      size: Number(body.size) || null,
      status: "uploaded",
      isPublic: false,
    },
  };
}

export function useEvidenceUploads(reportId: number | null, onDone: (item: EvidenceItem) => void) {
  const uppyRef = useRef<Uppy<Meta, Record<string, never>> | null>(null);
  const [ready, setReady] = useState(false);
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [problems, setProblems] = useState<string[]>([]);
  const done = useRef(onDone);
  useEffect(() => {
    done.current = onDone;
  });

  const update = useCallback(
    (id: string, change: Partial<Upload>) =>
      setUploads((list) => list.map((u) => (u.id === id ? { ...u, ...change } : u))),
    [],
  );

  const check = useCallback(
    async (id: string, evidenceId: number) => {
      update(id, { stage: "checking", sent: 1, evidenceId, problem: undefined });
      const answer = await complete(evidenceId);
      if (!answer.ok) return update(id, { stage: "failed", problem: answer.problem });
      setUploads((list) => list.filter((u) => u.id !== id));
      uppyRef.current?.removeFile(id);
      done.current(answer.item);
    },
    [update],
  );

  useEffect(() => {
    if (!reportId) return;
    let cancelled = false;
    let instance: Uppy<Meta, Record<string, never>> | null = null;
    void (async () => {
      const [{ default: UppyCore }, { default: AwsS3 }] = await Promise.all([
        import("@uppy/core"),
        import("@uppy/aws-s3"),
      ]);
      if (cancelled) return;
      const u = new UppyCore<Meta, Record<string, never>>({
        id: `evidence-${reportId}`,
        autoProceed: true,
        restrictions: { maxNumberOfFiles: 12 },
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
          }).catch(() => null);
          const body = (res ? await res.json().catch(() => ({})) : {}) as Record<string, unknown>;
          if (!res) throw new Error("No connection: the file is kept on your device, try again when you have signal.");
          if (!res.ok) throw new Error(typeof body.error === "string" ? body.error : "The upload was refused");
          u.setFileMeta(file.id, { evidenceId: Number(body.evidenceId) });
          return { url: String(body.url), key: String(body.key), headers: body.headers as Record<string, string> };
        },
      });
      u.on("upload-progress", (file, progress) => {
        if (file && progress.bytesTotal)
          update(file.id, { stage: "sending", sent: progress.bytesUploaded / progress.bytesTotal });
      });
      u.on("upload-success", (file) => {
        const evidenceId = file && u.getFile(file.id).meta.evidenceId;
        if (file && evidenceId) void check(file.id, evidenceId);
      });
      u.on("upload-error", (file, error) => {
        if (file) update(file.id, { stage: "failed", problem: error.message || "The upload stopped. Try again." });
      });
      instance = u;
      uppyRef.current = u;
      setReady(true);
    })();
    return () => {
      cancelled = true;
      instance?.destroy();
      uppyRef.current = null;
      setReady(false);
    };
  }, [reportId, update, check]);

  /** Starts sending the picked files; refused ones get a message instead. */
  const add = useCallback((files: FileList | File[]) => {
    const u = uppyRef.current;
    if (!u) return;
    for (const file of Array.from(files)) {
      const screened = screenFile(file);
      if ("problem" in screened) {
        setProblems((p) => [...p, screened.problem]);
        continue;
      }
      try {
        const id = u.addFile({ name: file.name, type: file.type, data: file, source: "bayproof" });
        setUploads((list) => [...list, { id, name: file.name, sent: 0, stage: "sending" }]);
      } catch (error) {
        const message =
          error instanceof Error && /already added|duplicate/i.test(error.message)
            ? "that file is already on its way"
            : "at most 12 files per report";
        setProblems((p) => [...p, `${file.name}: ${message}.`]);
      }
    }
  }, []);

  /** Tries a failed file again: the whole upload, or only the server's check when storage has it. */
  const retry = useCallback(
    (upload: Upload) => {
      if (upload.evidenceId) return void check(upload.id, upload.evidenceId);
      update(upload.id, { stage: "sending", sent: 0, problem: undefined });
      void uppyRef.current?.retryUpload(upload.id);
    },
    [check, update],
  );

  const remove = useCallback((upload: Upload) => {
    uppyRef.current?.removeFile(upload.id);
    setUploads((list) => list.filter((u) => u.id !== upload.id));
  }, []);

  return { ready, uploads, problems, add, retry, remove, dismissProblems: () => setProblems([]) };
}
