// A tiny cookie-keeping HTTP client for driving the served app the way a browser would.
import { inject } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "../../db/schema";
import { newSession } from "./sessions";

export { cookieValue } from "./sessions";

export const baseUrl = () => inject("baseUrl");

export class Browserish {
  cookies = new Map<string, string>();

  constructor(readonly origin = baseUrl()) {}

  private cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  private keep(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair!.indexOf("=");
      const name = pair!.slice(0, eq).trim();
      const value = pair!.slice(eq + 1).trim();
      if (!value || /max-age=0|expires=thu, 01 jan 1970/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async get(url: string, headers: Record<string, string> = {}) {
    const res = await fetch(new URL(url, this.origin), {
      redirect: "manual",
      headers: { cookie: this.cookieHeader(), ...headers },
    });
    this.keep(res);
    return res;
  }

  async post(url: string, form: Record<string, string>, headers: Record<string, string> = { origin: this.origin }) {
    const res = await fetch(new URL(url, this.origin), {
      method: "POST",
      redirect: "manual",
      headers: { cookie: this.cookieHeader(), "content-type": "application/x-www-form-urlencoded", ...headers },
      body: new URLSearchParams(form),
    });
    this.keep(res);
    return res;
  }
}

/** Signs a client in as the user with this e-mail by creating a session row directly. */
export async function signedInAs(db: Kysely<Database>, email: string) {
  const client = new Browserish();
  client.cookies.set("bayproof_session", (await newSession(db, email)).cookie);
  return client;
}
