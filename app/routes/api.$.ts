import { apiError } from "~/utils/forms";

// Any other /api path: a JSON 404, as an API client expects, never the HTML page.
const notFound = () => apiError(404, "not_found", "No such API endpoint; the open feed's list is at /api/v1.");

export async function loader() {
  return notFound();
}

export async function action() {
  return notFound();
}
