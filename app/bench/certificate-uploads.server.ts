// Certificate uploads: the browser sends the calibration certificate straight to storage through a
// presigned PUT under the owner's own upload folder; saving the calibration copies it out and checks
// the copy's bytes (rig-registry.server.ts, attachCertificate).
import type { Db } from "../../db/database";
import { AppError } from "../utils/errors";
import { randomToken } from "../utils/tokens.server";
import { isCertificateType, MAX_CERTIFICATE_BYTES } from "../storage/certificate-types";
import { certificateUploadPrefix } from "./certificate";
import { rigForOwner } from "./rig-registry.server";
import { presignedUpload } from "./trace-uploads.server";

export async function createCertificateUpload(
  db: Db,
  userId: number,
  rigId: number,
  file: { type: string; size: number },
) {
  await rigForOwner(db, userId, rigId);
  if (!isCertificateType(file.type))
    throw new AppError("A certificate must be a PDF, PNG or JPEG file", 415, { field: "certificate" });
  if (file.size > MAX_CERTIFICATE_BYTES)
    throw new AppError(`A certificate may be at most ${MAX_CERTIFICATE_BYTES / 1024 / 1024} MB`, 413, {
      field: "certificate",
    });
  return presignedUpload(`${certificateUploadPrefix(userId)}${randomToken(18)}`, file.type, file.size);
}
