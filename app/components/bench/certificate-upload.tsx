// The calibration certificate: sent straight to storage through a presigned PUT once chosen; the
// hidden field carries the upload's key and the server checks the file when the calibration is
// saved. Without JavaScript nothing can be sent, so the input stays disabled and the hint says why.
import { useRef, useState, useSyncExternalStore } from "react";
import { type CertificateType, isCertificateType, MAX_CERTIFICATE_BYTES } from "~/storage/certificate-types";
import { controlProps, FieldError } from "../field";
import { presignedUpload } from "./presigned-upload";

type State = { stage: "idle" | "sending" | "sent"; name?: string } | { stage: "failed"; problem: string };

const BY_EXTENSION: Record<string, CertificateType> = {
  pdf: "application/pdf",
  png: "image/png",
  jpg: "image/jpeg",
  jpeg: "image/jpeg",
};

function typeOf(file: File): CertificateType | null {
  if (isCertificateType(file.type)) return file.type;
  return file.type ? null : (BY_EXTENSION[file.name.split(".").pop()?.toLowerCase() ?? ""] ?? null);
}

const noSubscription = () => () => {};

export const CERTIFICATE_LABEL = "Calibration certificate (optional)";

export function CertificateUpload({ rigId, initialKey, error }: { rigId: number; initialKey: string; error?: string }) {
  // False in the server's HTML (nothing can be sent without JavaScript), true once hydrated.
  const ready = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  const [key, setKey] = useState(initialKey);
  const [state, setState] = useState<State>({ stage: "idle" });
  // A refused upload is gone from storage: it must be chosen again.
  const [seenError, setSeenError] = useState(error);
  if (error !== seenError) {
    setSeenError(error);
    if (error) {
      setKey("");
      setState({ stage: "idle" });
    }
  }
  // Only the latest choice counts, should an earlier one finish after it.
  const latest = useRef(0);
  const id = "certificate";
  const kinds = "PDF, PNG or JPEG";
  const limit = `${MAX_CERTIFICATE_BYTES / 1024 / 1024} MB`;

  async function onFile(file: File | undefined) {
    const turn = ++latest.current;
    setKey("");
    if (!file) return setState({ stage: "idle" });
    const type = typeOf(file);
    if (!type) return setState({ stage: "failed", problem: `${file.name}: a certificate must be a ${kinds} file.` });
    if (file.size > MAX_CERTIFICATE_BYTES)
      return setState({ stage: "failed", problem: `${file.name}: a certificate may be at most ${limit}.` });
    setState({ stage: "sending", name: file.name });
    try {
      const uploaded = await presignedUpload("/api/bench/certificates", { rigId, type, size: file.size }, file);
      if (turn !== latest.current) return;
      setKey(uploaded);
      setState({ stage: "sent", name: file.name });
    } catch (e) {
      if (turn === latest.current) setState({ stage: "failed", problem: (e as Error).message });
    }
  }

  // The server's refusal stands until another file is chosen.
  const problem = state.stage === "failed" ? state.problem : state.stage === "idle" ? error : undefined;
  const hint = `The certificate from whoever calibrated the rig: a ${kinds} file (a scan or a photo will do), at most ${limit}. Sending it needs JavaScript; without it the calibration is saved without a certificate.`;
  return (
    <div className="space-y-1">
      <input type="hidden" name="certificate" value={key} />
      <label htmlFor={id} className="block font-semibold">
        {CERTIFICATE_LABEL}
      </label>
      <span id={`${id}-description`} className="block text-sm text-stone-600">
        {hint}
      </span>
      <input
        type="file"
        accept=".pdf,.png,.jpg,.jpeg,application/pdf,image/png,image/jpeg"
        disabled={!ready}
        onChange={(e) => void onFile(e.currentTarget.files?.[0])}
        className="mt-1 block min-h-11 w-full text-base"
        {...controlProps(id, problem, hint)}
      />
      <FieldError id={id} message={problem} />
      <p aria-live="polite" className="text-sm text-stone-700">
        {state.stage === "sending" && `Sending ${state.name}… Save once it is attached.`}
        {state.stage === "sent" && `${state.name} is attached. The server checks it when you save.`}
        {state.stage === "idle" && key && "A certificate is attached."}
      </p>
    </div>
  );
}
