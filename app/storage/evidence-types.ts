// What may be uploaded as evidence, shared by the uploader in the browser and the server checks.
import type { EvidenceKind } from "~/domain";

export const EVIDENCE_TYPES = {
  "video/mp4": { kind: "video", ext: ["mp4", "m4v"] },
  "video/quicktime": { kind: "video", ext: ["mov"] },
  "video/webm": { kind: "video", ext: ["webm"] },
  "image/jpeg": { kind: "photo", ext: ["jpg", "jpeg"] },
  "image/png": { kind: "photo", ext: ["png"] },
  "image/heic": { kind: "photo", ext: ["heic"] },
} as const satisfies Record<string, { kind: EvidenceKind; ext: readonly string[] }>;

export type EvidenceType = keyof typeof EVIDENCE_TYPES;
export const MAX_BYTES = { video: 500 * 1024 * 1024, photo: 25 * 1024 * 1024 } as const satisfies Record<
  EvidenceKind,
  number
>;

export const isEvidenceType = (t: string): t is EvidenceType => Object.hasOwn(EVIDENCE_TYPES, t);
