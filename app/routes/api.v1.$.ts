import { errorResponse, FeedError } from "~/feed/http.server";

// Any other /api/v1 path: a JSON 404 pointing at the index.
export async function loader() {
  return errorResponse(new FeedError(404, "not_found", "No such feed endpoint; see /api/v1 for the list."));
}
