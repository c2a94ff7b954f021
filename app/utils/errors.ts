// Expected failures (a bad value, a missing or forbidden record, a clash, a service out of reach)
// are one error type, thrown by the features and turned into an answer in one place, by the kind of
// route that answers. Anything else is a bug and stays a 500.
import { data } from "react-router";

export interface FailureDetails {
  /** A stable machine-readable code (the feed's JSON errors carry it). */
  code?: string;
  /** The form field or query parameter at fault. */
  field?: string;
  /** Headers the answer carries (Retry-After, WWW-Authenticate, Allow…). */
  headers?: Record<string, string>;
}

const CODES: Record<number, string> = {
  400: "bad_request",
  401: "unauthorized",
  403: "forbidden",
  404: "not_found",
  405: "method_not_allowed",
  409: "conflict",
  413: "too_large",
  415: "unsupported_media_type",
  422: "unprocessable",
  429: "rate_limited",
  503: "unavailable",
};

export class AppError extends Error {
  readonly code: string;
  readonly field?: string;
  readonly headers: Record<string, string>;
  constructor(
    message: string,
    readonly status = 400,
    details: FailureDetails = {},
  ) {
    super(message);
    this.code = details.code ?? CODES[status] ?? "error";
    this.field = details.field;
    this.headers = details.headers ?? {};
  }
}

/**
 * How each kind of route answers an expected failure:
 * - `page`: a response for the error boundary (text body), to throw from a page's loader or action;
 * - `form`: action data `{ ok: false, message, field? }` that the page shows beside the form;
 * - `api`: JSON `{ error: message }` for the app's own /api/ routes;
 * - `feed`: JSON `{ error: { code, message, parameter? } }`, never cached, for /api/v1.
 */
type Shape = "page" | "form" | "api" | "feed";

/** The one mapper: an AppError becomes its answer in `shape`; any other error is thrown on. */
export function failureAnswer(error: unknown, shape: "api" | "feed"): Response;
export function failureAnswer(error: unknown, shape: "page"): ReturnType<typeof data<string>>;
/** `extra` goes beside the message (what the user typed, say), so nothing typed is lost. */
export function failureAnswer<X extends object = object>(
  error: unknown,
  shape: "form",
  extra?: X,
): ReturnType<typeof data<FormFailure & X>>;
export function failureAnswer(error: unknown, shape: Shape, extra: object = {}) {
  if (!(error instanceof AppError)) throw error;
  const { status, message, headers } = error;
  switch (shape) {
    case "page":
      return data(message, { status, headers });
    case "form":
      return data(
        { ok: false as const, message, ...(error.field ? { field: error.field } : {}), ...extra },
        { status, headers },
      );
    case "api":
      return Response.json({ error: message }, { status, headers });
    case "feed":
      return Response.json(
        { error: { code: error.code, message, ...(error.field ? { parameter: error.field } : {}) } },
        { status, headers: { "Cache-Control": "no-store", ...headers } },
      );
  }
}

export interface FormFailure {
  ok: false;
  message: string;
  field?: string;
}
