// The home page's "What brings you here": the four people Bayproof is for, each with the page where their work starts.
import { Link } from "react-router";
import { buttonClass, Card } from "~/components/ui";

const AUDIENCES = [
  {
    id: "choosing",
    title: "Choosing a tool for a job",
    body: "Pick the job, then see which tools freed it, how often and how fast — and whether your compressor, hose and couplers can feed them.",
    links: [
      { to: "/jobs", label: "Start from the job" },
      { to: "/air", label: "Check your air" },
    ],
  },
  {
    id: "filing",
    title: "Working in the bay",
    body: "Finished a stubborn job? File what happened: the tool, the pressure at its inlet, the hose, the outcome and a short video of the gauge. A few minutes on your phone.",
    links: [
      { to: "/reports/new", label: "File a report" },
      { to: "/me/reports", label: "Your reports" },
    ],
  },
  {
    id: "moderating",
    title: "Checking reports",
    body: "Moderators watch the evidence, check each claim against it and record why a report was accepted or turned down. Every decision is kept in the report's history.",
    links: [{ to: "/review", label: "Review queue" }],
  },
  {
    id: "research",
    title: "Studying the numbers",
    body: "Every accepted report is open data under CC BY 4.0: download the whole set, or ask the API for reports, tools, jobs and the summary figures.",
    links: [
      { to: "/data", label: "Open data" },
      { to: "/api/v1", label: "The API", reload: true },
    ],
  },
] as const;

export function Audiences() {
  return (
    <section aria-labelledby="who-heading">
      <h2 id="who-heading" className="mb-3 text-xl font-bold">
        What brings you here
      </h2>
      <div className="grid gap-4 sm:grid-cols-2">
        {AUDIENCES.map((a) => (
          <Card as="article" key={a.id} className="flex flex-col" aria-labelledby={`who-${a.id}`}>
            <h3 id={`who-${a.id}`} className="font-semibold text-bay-700">
              {a.title}
            </h3>
            <p className="mt-1 flex-1 text-sm text-stone-700">{a.body}</p>
            <p className="mt-3 flex flex-wrap gap-2">
              {a.links.map((l) => (
                <Link
                  key={l.to}
                  to={l.to}
                  reloadDocument={"reload" in l}
                  className={buttonClass("secondary", "sm", "inline-flex min-h-11 items-center")}
                >
                  {l.label}
                </Link>
              ))}
            </p>
          </Card>
        ))}
      </div>
    </section>
  );
}
