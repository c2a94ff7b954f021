// Trace uploads: the browser sends a rig's CSV straight to storage through a presigned PUT under the
// filer's own upload folder; the run's submission copies it out and analyses the copy.
import type { Db } from "../../db/database";
import { isStorageOutage, presignPut } from "../storage/s3.server";
import { AppError } from "../utils/errors";
import { randomToken } from "../utils/tokens.server";
import { ownedRig } from "./filing.server";
import { MAX_TRACE_BYTES } from "./traces.server";

export async function createTraceUpload(db: Db, userId: number, rigId: number, size: number) {
  await ownedRig(db, userId, rigId);
  if (size > MAX_TRACE_BYTES)
    throw new AppError(`A trace file may be at most ${MAX_TRACE_BYTES / 1024 / 1024} MB; export a shorter trial`, 413);
  return presignedUpload(`uploads/bench/${userId}/${randomToken(18)}`, "text/csv", size);
}

/** A presigned PUT for a rig owner's upload under `key` (traces, certificates); 503 while storage is down. */
export async function presignedUpload(key: string, type: string, size: number) {
  try {
    return { key, url: await presignPut(key, type, size), headers: { "Content-Type": type } };
  } catch (error) {
    if (isStorageOutage(error)) throw new AppError("The file store could not be reached; try again shortly", 503);
    throw error;
  }
}
