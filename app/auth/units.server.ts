// The viewer's one unit system (issue 18). A signed-in user's lives on their row (length_unit names
// the system; a CHECK keeps pressure_unit and force_unit in step); a visitor's in a cookie, else the
// system their browser's language suggests.
import { createCookie } from "react-router";
import { isHttps } from "~/config.server";
import {
  type PressureUnit,
  systemForLocale,
  systemOfLength,
  type Units,
  unitsOf,
  type UnitSystem,
  UNIT_SYSTEMS,
} from "~/domain";
import type { Db } from "../../db/database";
import { getUser } from "./session.server";

export const unitsCookie = createCookie(isHttps ? "__Host-bayproof_units" : "bayproof_units", {
  httpOnly: true,
  sameSite: "lax",
  secure: isHttps,
  path: "/",
  maxAge: 365 * 24 * 3600,
});

const isSystem = (x: unknown): x is UnitSystem =>
  typeof x === "string" && (UNIT_SYSTEMS as readonly string[]).includes(x);

/** The visitor's remembered choice, or null. */
async function cookieSystem(cookieHeader: string | null): Promise<UnitSystem | null> {
  const value: unknown = await unitsCookie.parse(cookieHeader).catch(() => null);
  return isSystem(value) ? value : null;
}

/** A visitor's system from their Cookie and Accept-Language headers (the server's early cache answer reads them raw). */
export async function visitorSystemOf(cookieHeader: string | null, acceptLanguage: string | null): Promise<UnitSystem> {
  return (await cookieSystem(cookieHeader)) ?? systemForLocale(acceptLanguage);
}

/** A visitor's system (not signed in): their remembered choice, else their browser's language's. */
export const visitorSystem = (request: Request): Promise<UnitSystem> =>
  visitorSystemOf(request.headers.get("cookie"), request.headers.get("accept-language"));

/** The units every figure on the page is shown in, for whoever is asking. */
export async function unitsFor(request: Request): Promise<Units> {
  const user = await getUser(request);
  if (user) return unitsOf(systemOfLength(user.lengthUnit), user.pressureUnit);
  return unitsOf(await visitorSystem(request));
}

/** A signed-in user's system; `pressure` picks bar or kPa for metric readers (kPa unless asked). */
export async function saveUserUnits(db: Db, userId: number, system: UnitSystem, pressure?: PressureUnit) {
  const u = unitsOf(system, pressure);
  await db
    .updateTable("users")
    .set({ pressure_unit: u.pressure, length_unit: u.length, force_unit: u.force })
    .where("id", "=", userId)
    .execute();
}

/** Remembers a visitor's choice: the Set-Cookie header value. */
export const rememberVisitorUnits = (system: UnitSystem) => unitsCookie.serialize(system);
