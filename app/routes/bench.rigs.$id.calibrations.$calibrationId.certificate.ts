import { redirect } from "react-router";
import { getUser, hasRole } from "~/auth/session.server";
import { certificateFor } from "~/bench/rig-registry.server";
import { db } from "~/db.server";
import { presignGet, readHead } from "~/storage/s3.server";
import { sniffCertificateType } from "~/storage/sniff.server";
import { AppError, failureAnswer } from "~/utils/errors";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/bench.rigs.$id.calibrations.$calibrationId.certificate";

const EXTENSION = { "application/pdf": "pdf", "image/png": "png", "image/jpeg": "jpg" } as const;

// A calibration's certificate, for the rig's owner and moderators: a redirect to a five-minute link
// to the file. Anyone else, like a calibration without a certificate, gets 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  const rigId = parseIdParam(params.id, "No such certificate");
  const calibrationId = parseIdParam(params.calibrationId, "No such certificate");
  const user = await getUser(request);
  const viewer = user && { id: user.id, moderator: hasRole(user, "moderator") };
  try {
    const key = await certificateFor(db, viewer, rigId, calibrationId);
    if (!key) throw new AppError("No such certificate", 404);
    // The type from the stored bytes (checked when saved), so the browser shows it as what it is.
    const type = await sniffCertificateType(await readHead(key)).catch(() => null);
    const url = await presignGet(key, 300, {
      contentType: type ?? "application/octet-stream",
      disposition: `${type ? "inline" : "attachment"}; filename="calibration-${calibrationId}-certificate.${type ? EXTENSION[type] : "bin"}"`,
    });
    return redirect(url, { headers: { "Cache-Control": "private, no-store" } });
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}
