import { data } from "react-router";
import { db } from "~/db.server";
import { ErrorPage } from "~/components/error-page";
import { DayView } from "~/components/exposure/day-view";
import { dayCalculator } from "~/exposure/pages.server";
import type { Route } from "./+types/day";

// A day on the tools: rows of tool, job and jobs per day from the URL (a GET form that works without
// JavaScript), worked out into the day's vibration and noise. Open to anyone; a row that cannot be used
// answers 400 with its field's message and every value as typed.
export async function loader({ request }: Route.LoaderArgs) {
  const calc = await dayCalculator(db, new URL(request.url));
  return data(calc, { status: Object.keys(calc.errors).length > 0 ? 400 : 200 });
}

export default function Day({ loaderData }: Route.ComponentProps) {
  return <DayView {...loaderData} />;
}

export function meta() {
  return [
    { title: "A day on the tools — Bayproof" },
    {
      name: "description",
      content: "Hand-arm vibration A(8) and noise dose for a day of jobs with the tools you pick, with intervals.",
    },
  ];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
