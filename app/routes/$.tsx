import { refuse } from "~/utils/http";

// Any address no other route claims: a real 404 rendered by the root error boundary.
export async function loader() {
  refuse("Not found", 404);
}

export default function NotFound() {
  return null;
}
