import { Link } from "react-router";
import { unitsFor } from "~/auth/units.server";
import { protocolVersions } from "~/bench/protocols.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { ProtocolCard } from "~/components/bench/protocol";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { invariantResponse } from "~/utils/http";
import { parseSlug } from "~/utils/params";
import type { Route } from "./+types/bench.protocols.$slug";

export async function loader({ params, request }: Route.LoaderArgs) {
  const slug = parseSlug(params.slug);
  const [versions, units] = await Promise.all([protocolVersions(db, slug), unitsFor(request)]);
  invariantResponse(versions, "No such protocol", 404);
  return { versions, units };
}

export default function ProtocolPage({ loaderData }: Route.ComponentProps) {
  const { versions, units } = loaderData;
  const newest = versions[0]!;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to="/bench" className="inline-flex min-h-11 items-center text-bay-700 underline">
            Bench runs
          </Link>
        </p>
        <h1 className="text-2xl font-bold">{newest.title}</h1>
        <p className="text-stone-700">
          {versions.length} version{versions.length === 1 ? "" : "s"}. A version is frozen once a run uses it; any
          change after that is declared as a new version, so every run says exactly what it followed.
        </p>
      </header>
      <section aria-labelledby="versions-heading" className="space-y-3">
        <h2 id="versions-heading" className="text-lg font-semibold">
          Versions, newest first
        </h2>
        {versions.map((v) => (
          <ProtocolCard key={v.id} protocol={v} units={units} link={false} />
        ))}
      </section>
      <BenchSafetyCautions />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `${data.versions[0]!.title} — Bayproof` : "Protocol not found — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
