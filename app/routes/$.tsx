import { data } from "react-router";

// Any address no other route claims: a real 404 rendered by the root error boundary.
export async function loader() {
  throw data("Not found", { status: 404 });
}

export default function NotFound() {
  return null;
}
