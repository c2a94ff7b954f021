import { isRouteErrorResponse, Link } from "react-router";
import { Card } from "./ui";

// One rendering of thrown responses and errors for every route: per-status messages,
// stack traces only in development.
const STATUS_MESSAGES: Record<number, { title: string; body: string }> = {
  400: { title: "That request didn't make sense", body: "Something in the address or the form is not valid." },
  401: { title: "Sign in needed", body: "Sign in to see this page." },
  403: { title: "Not allowed", body: "Your account cannot see or change this." },
  409: { title: "That clashes with something already there", body: "Nothing was changed." },
  429: { title: "Too many tries", body: "Wait a few minutes and try again." },
  413: {
    title: "That was too much to send",
    body: "The form is larger than Bayproof accepts. Shorten the text and send it again.",
  },
  415: { title: "That form could not be read", body: "Send the form from Bayproof's own page." },
  503: {
    title: "Bayproof is busy for a moment",
    body: "The database could not be reached, so nothing was changed. Try again in a few seconds.",
  },
  404: { title: "Not found", body: "There is no page here. The tool, job or report may have moved or never existed." },
};

export function ErrorPage({ error }: { error: unknown }) {
  let title = "Something went wrong";
  let body = "The error has been logged. Try again in a moment.";
  let detail: string | undefined;
  let stack: string | undefined;
  if (isRouteErrorResponse(error)) {
    const known = STATUS_MESSAGES[error.status];
    title = known?.title ?? `${error.status} ${error.statusText}`;
    body = known?.body ?? body;
    detail = typeof error.data === "string" && error.data !== known?.title ? error.data : undefined;
  } else if (import.meta.env.DEV && error instanceof Error) {
    detail = error.message;
    stack = error.stack;
  }
  return (
    <Card as="section" padding="lg">
      {/* React places this in the head: an error page is never an untitled page. */}
      <title>{`${title} — Bayproof`}</title>
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="mt-2 text-stone-700">{body}</p>
      {detail && <p className="mt-2 text-stone-700">{detail}</p>}
      {stack && <pre className="mt-4 overflow-x-auto rounded bg-stone-100 p-3 text-xs">{stack}</pre>}
      <p className="mt-4">
        <Link to="/" className="text-bay-700 underline">
          Back to the start page
        </Link>
      </p>
    </Card>
  );
}
