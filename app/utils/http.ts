import { data } from "react-router";

/** Throws an HTTP error response (rendered by the error boundary) unless the condition holds. */
export function invariantResponse(condition: unknown, message: string, status = 404): asserts condition {
  if (!condition) throw data(message, { status, statusText: message });
}
