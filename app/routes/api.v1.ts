import { admit } from "~/feed/access.server";
import { db, pool } from "~/db.server";
import { callerContext } from "~/feed/context";
import { feedError } from "~/feed/http.server";
import { failureAnswer } from "~/utils/errors";
import type { Route } from "./+types/api.v1";

const CORS = {
  "Access-Control-Allow-Origin": "*",
  "Access-Control-Expose-Headers":
    "ETag, Link, RateLimit, RateLimit-Policy, Retry-After, Content-Disposition, Content-Range, Accept-Ranges, Content-Length",
};

// Every /api/v1 request: open CORS for reading, only GET and HEAD, and the rate limits (which
// also check an API key when one is sent). The routes below run only for admitted callers.
export const middleware: Route.MiddlewareFunction[] = [
  async ({ request, context }, next) => {
    const method = request.method.toUpperCase();
    if (method === "OPTIONS") {
      return new Response(null, {
        status: 204,
        headers: {
          ...CORS,
          "Access-Control-Allow-Methods": "GET, HEAD, OPTIONS",
          "Access-Control-Allow-Headers": "Authorization, If-None-Match, Range, If-Range",
          "Access-Control-Max-Age": "86400",
        },
      });
    }
    let response: Response;
    if (method !== "GET" && method !== "HEAD") {
      response = failureAnswer(
        feedError(405, "method_not_allowed", "The feed is read-only: use GET.", undefined, {
          Allow: "GET, HEAD, OPTIONS",
        }),
        "feed",
      );
    } else {
      try {
        const caller = await admit(db, pool, request);
        context.set(callerContext, caller);
        response = await next();
        for (const [k, v] of Object.entries(caller.headers)) response.headers.set(k, v);
      } catch (error) {
        response = failureAnswer(error, "feed");
      }
    }
    for (const [k, v] of Object.entries(CORS)) response.headers.set(k, v);
    return response;
  },
];
