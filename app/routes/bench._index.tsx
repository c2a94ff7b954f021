import { Link } from "react-router";
import { unitsFor } from "~/auth/units.server";
import { getUser, hasRole } from "~/auth/session.server";
import { listProtocols } from "~/bench/protocols.server";
import { unverifiedCalibrations } from "~/bench/rig-registry.server";
import { listRigs } from "~/bench/rigs.server";
import { latestAcceptedRuns } from "~/bench/runs.server";
import { rigAgreements } from "~/bench/figures-read.server";
import { RigAgreementSection } from "~/components/bench-figures/rig-agreement";
import { BenchIntro } from "~/components/bench/bench-intro";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { PendingCalibrations } from "~/components/bench/calibration-verify";
import { ProtocolCard } from "~/components/bench/protocol";
import { RigList } from "~/components/bench/rig-status";
import { RunList } from "~/components/bench/run-list";
import { ErrorPage } from "~/components/error-page";
import { buttonClass } from "~/components/ui";
import { db } from "~/db.server";
import type { Route } from "./+types/bench._index";

export async function loader({ request }: Route.LoaderArgs) {
  const [user, units, protocols, rigs, runs] = await Promise.all([
    getUser(request),
    unitsFor(request),
    listProtocols(db),
    listRigs(db),
    latestAcceptedRuns(db, 15),
  ]);
  const ownsRig = user != null && rigs.some((r) => r.owner_id === user.id);
  const [agreements, pending] = await Promise.all([
    rigAgreements(db),
    // Moderators see the calibrations waiting on other people's rigs (the review queue's page is at its script allowance).
    user && hasRole(user, "moderator") ? unverifiedCalibrations(db, user.id) : null,
  ]);
  return { units, protocols, rigs, runs, ownsRig, signedIn: user != null, agreements, pending };
}

export default function BenchPage({ loaderData }: Route.ComponentProps) {
  const { units, protocols, rigs, runs, ownsRig, signedIn, pending } = loaderData;
  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-bold">Bench runs</h1>
        <BenchIntro />
        {signedIn && (
          <p className="flex flex-wrap gap-3">
            {ownsRig && (
              <Link to="/bench/runs/new" className={buttonClass("primary", "md", "inline-block")}>
                File a bench run
              </Link>
            )}
            <Link to="/bench/rigs/new" className={buttonClass("secondary", "md", "inline-block")}>
              Register your rig
            </Link>
          </p>
        )}
      </header>

      {pending && <PendingCalibrations pending={pending} showRig />}

      <BenchSafetyCautions />

      <section aria-labelledby="protocols-heading" className="space-y-3">
        <h2 id="protocols-heading" className="text-lg font-semibold">
          Protocols
        </h2>
        {protocols.map((p) => (
          <ProtocolCard key={p.id} protocol={p} units={units} />
        ))}
      </section>

      <section aria-labelledby="rigs-heading" className="space-y-2">
        <h2 id="rigs-heading" className="text-lg font-semibold">
          Rigs
        </h2>
        <p className="text-sm text-stone-600">
          A rig's runs count only while its calibration is verified by a moderator and younger than its set age.
        </p>
        <RigList rigs={rigs} units={units} />
      </section>

      <RigAgreementSection rows={loaderData.agreements} units={units} />

      <section aria-labelledby="runs-heading" className="space-y-2">
        <h2 id="runs-heading" className="text-lg font-semibold">
          Latest accepted runs
        </h2>
        <RunList runs={runs} units={units} />
      </section>
    </div>
  );
}

export function meta() {
  return [
    { title: "Bench runs — Bayproof" },
    { name: "description", content: "Peak force and torque measured on calibrated rigs under declared protocols." },
  ];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
