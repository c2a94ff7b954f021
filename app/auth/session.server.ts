// Sessions in PostgreSQL: the cookie carries a random id, the database only its SHA-256.
// Idle timeout 14 days (extended as the user comes back), absolute lifetime 60 days.
import { AsyncLocalStorage } from "node:async_hooks";
import { createCookie, redirect } from "react-router";
import { sql } from "kysely";
import { isHttps } from "~/config.server";
import type { ForceUnit, LengthUnit, PressureUnit } from "~/domain";
import { invariantResponse } from "~/utils/http";
import { type Db, PREPARED } from "../../db/database";
import { randomToken, sha256Hex } from "~/utils/tokens.server";

export const IDLE_TIMEOUT_MS = 14 * 24 * 3600_000;
export const ABSOLUTE_LIFETIME_MS = 60 * 24 * 3600_000;
const TOUCH_EVERY_MS = 10 * 60_000;

export const sessionCookie = createCookie(isHttps ? "__Host-bayproof_session" : "bayproof_session", {
  httpOnly: true,
  sameSite: "lax",
  secure: isHttps,
  path: "/",
  maxAge: ABSOLUTE_LIFETIME_MS / 1000,
});

export type Role = "moderator" | "admin";

export interface SessionUser {
  id: number;
  handle: string;
  email: string;
  roles: Role[];
  pressureUnit: PressureUnit;
  lengthUnit: LengthUnit;
  forceUnit: ForceUnit;
  sessionHash: string;
}

export async function createSession(db: Db, userId: number, method: "oidc" | "email_link", request: Request) {
  const token = randomToken();
  await db
    .insertInto("sessions")
    .values({
      id_hash: sha256Hex(token),
      user_id: userId,
      expires_at: new Date(Date.now() + ABSOLUTE_LIFETIME_MS),
      user_agent: request.headers.get("user-agent")?.slice(0, 400) ?? null,
      sign_in_method: method,
    })
    .execute();
  return sessionCookie.serialize(token);
}

async function readToken(request: Request): Promise<string | null> {
  const value: unknown = await sessionCookie.parse(request.headers.get("cookie"));
  return typeof value === "string" && /^[A-Za-z0-9_-]{43}$/.test(value) ? value : null;
}

/**
 * Whether the request carries a session cookie at all (valid or not), without reading the database:
 * a request without one is an anonymous visitor's, whose public pages may come from a shared cache.
 */
export const mayHoldSession = (request: Request): boolean => cookieMayHoldSession(request.headers.get("cookie"));

/** mayHoldSession on a raw Cookie header. */
export function cookieMayHoldSession(header: string | null | undefined): boolean {
  if (!header) return false;
  return header.split(";").some((pair) => {
    const eq = pair.indexOf("=");
    return eq > 0 && pair.slice(0, eq).trim() === sessionCookie.name && pair.slice(eq + 1).trim() !== "";
  });
}

/** The session's user, read from the database. Pages and guards use `getUser`, read once per request. */
async function readSessionUser(db: Db, request: Request): Promise<SessionUser | null> {
  const token = await readToken(request);
  if (!token) return null;
  const hash = sha256Hex(token);
  // Every signed-in request runs this: prepared once per connection (db/database.ts, PREPARED).
  const idleSeconds = `${IDLE_TIMEOUT_MS / 1000} seconds`;
  const row = (
    await sql<{
      id: number;
      handle: string;
      email: string;
      pressure_unit: PressureUnit;
      length_unit: LengthUnit;
      force_unit: ForceUnit;
      last_seen_at: Date;
      roles: Role[];
    }>`${sql.raw(PREPARED)}
      select u.id, u.handle, u.email, u.pressure_unit, u.length_unit, u.force_unit, s.last_seen_at,
        coalesce((select array_agg(ur.role order by ur.role) from user_roles ur where ur.user_id = u.id), '{}') as roles
      from sessions s join users u on u.id = s.user_id
      where s.id_hash = ${hash} and s.expires_at > now() and s.last_seen_at > now() - ${idleSeconds}::interval
        and u.banned_at is null`.execute(db)
  ).rows[0];
  if (!row) return null;
  if (Date.now() - new Date(row.last_seen_at).getTime() > TOUCH_EVERY_MS) {
    await db
      .updateTable("sessions")
      .set({ last_seen_at: sql`now()` })
      .where("id_hash", "=", hash)
      .execute();
  }
  return {
    id: row.id,
    handle: row.handle,
    email: row.email,
    roles: row.roles,
    pressureUnit: row.pressure_unit,
    lengthUnit: row.length_unit,
    forceUnit: row.force_unit,
    sessionHash: hash,
  };
}

// The root middleware runs each request's handling inside `withSessions(db, …)`. A GET's loaders
// (root and route) share one read of the session; an action reads it afresh each time it asks, and
// the loaders that follow a document POST (React Router gives them a GET request of their own) read
// the user as the action left it.
interface Serving {
  db: Db;
  users: WeakMap<Request, Promise<SessionUser | null>>;
}
const serving = new AsyncLocalStorage<Serving>();

/** Runs one request's handling (the root middleware) with the database its guards read from. */
export function withSessions<T>(db: Db, work: () => T): T {
  return serving.run({ db, users: new WeakMap() }, work);
}

/** The signed-in user, or null. A tampered, expired or revoked cookie is simply no session. */
export function getUser(request: Request): Promise<SessionUser | null> {
  const store = serving.getStore();
  if (!store) throw new Error("getUser: called outside withSessions (the root middleware)");
  const method = request.method.toUpperCase();
  if (method !== "GET" && method !== "HEAD") return readSessionUser(store.db, request);
  let user = store.users.get(request);
  if (!user) {
    user = readSessionUser(store.db, request);
    store.users.set(request, user);
  }
  return user;
}

function signInRedirect(request: Request) {
  const url = new URL(request.url);
  const back = url.pathname.replace(/\.data$/, "") + url.search;
  return redirect(`/sign-in?redirectTo=${encodeURIComponent(back)}`);
}

/** Pages: a visitor is sent to /sign-in and brought back afterwards. */
export async function requireUser(request: Request): Promise<SessionUser> {
  const user = await getUser(request);
  if (!user) throw signInRedirect(request);
  return user;
}

export const hasRole = (user: SessionUser | null, role: Role) =>
  !!user && (user.roles.includes(role) || user.roles.includes("admin"));

/** Admins hold every right; a moderator page admits moderators and admins. */
export async function requireRole(request: Request, role: Role): Promise<SessionUser> {
  const user = await requireUser(request);
  invariantResponse(hasRole(user, role), `This needs the ${role} role`, 403);
  return user;
}

/** Ends the current session; returns the Set-Cookie that clears it. */
export async function destroySession(db: Db, request: Request) {
  const token = await readToken(request);
  if (token) await db.deleteFrom("sessions").where("id_hash", "=", sha256Hex(token)).execute();
  return sessionCookie.serialize("", { maxAge: 0 });
}

/** Only same-site paths may follow sign-in, never another origin (the rule: ./redirect-path.ts). */
export { safeRedirectPath } from "./redirect-path";

/** Resource routes: a visitor gets a 401 with a reason, not a redirect. */
export async function requireApiUser(request: Request): Promise<SessionUser> {
  const user = await getUser(request);
  if (!user) throw Response.json({ error: "Sign in first" }, { status: 401 });
  return user;
}
