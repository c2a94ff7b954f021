import { feedError } from "~/feed/http.server";
import { failureAnswer } from "~/utils/errors";

// Any other /api/v1 path: a JSON 404 pointing at the index.
export async function loader() {
  return failureAnswer(feedError(404, "not_found", "No such feed endpoint; see /api/v1 for the list."), "feed");
}
