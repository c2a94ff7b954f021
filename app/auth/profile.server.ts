// The user's own profile: the public handle and the one unit system they enter and read figures in.
import type { z } from "zod";
import type { Db } from "../../db/database";
import { unitsOf } from "~/domain";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import type { profileSchema } from "./forms";

export type Profile = Omit<z.output<typeof profileSchema>, "intent">;

/** Whether another user already has this handle. */
export async function handleTaken(db: Db, handle: string, userId: number) {
  const row = await db
    .selectFrom("users")
    .select("id")
    .where("handle", "=", handle)
    .where("id", "!=", userId)
    .executeTakeFirst();
  return !!row;
}

/** Saves the profile; a handle someone else holds (checked first, and by the unique index when two race) is refused. */
export async function saveProfile(db: Db, userId: number, p: Profile): Promise<"saved" | "handle-taken"> {
  if (await handleTaken(db, p.handle, userId)) return "handle-taken";
  try {
    const u = unitsOf(p.units === "us" ? "us" : "metric", p.units === "metric-bar" ? "bar" : "kPa");
    await db
      .updateTable("users")
      .set({ handle: p.handle, pressure_unit: u.pressure, length_unit: u.length, force_unit: u.force })
      .where("id", "=", userId)
      .execute();
    // Public pages name reporters by handle.
    await notifyPagesChanged(db, "reporter");
    return "saved";
  } catch (error) {
    if ((error as { code?: string }).code === "23505") return "handle-taken";
    throw error;
  }
}
