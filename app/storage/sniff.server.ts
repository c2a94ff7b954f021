import { fileTypeFromBuffer } from "file-type";
import { type CertificateType, isCertificateType } from "./certificate-types";
import { type EvidenceType, isEvidenceType } from "./evidence-types";

/**
 * The real type of an upload from its first bytes (magic numbers), never from its name or the
 * browser's claim. HEIC is reported by file-type as image/heic (or heif brands), folded in here.
 */
export async function sniffEvidenceType(head: Uint8Array): Promise<EvidenceType | null> {
  const found = await fileTypeFromBuffer(head);
  if (!found) return null;
  const mime = found.mime === "image/heif" ? "image/heic" : found.mime;
  return isEvidenceType(mime) ? mime : null;
}

/** A calibration certificate's real type from its first bytes: PDF, PNG or JPEG, else null. */
export async function sniffCertificateType(head: Uint8Array): Promise<CertificateType | null> {
  const found = await fileTypeFromBuffer(head);
  return found && isCertificateType(found.mime) ? found.mime : null;
}
