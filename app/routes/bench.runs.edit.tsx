import { requireUser } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { benchEditorAction, benchEditorData } from "~/bench/editor.server";
import { BenchRunForm, RunChooser } from "~/components/bench/run-form";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { failureAnswer } from "~/utils/errors";
import { readForm } from "~/utils/forms";
import { parseIdParam, parseIdSearchParam } from "~/utils/params";
import type { Route } from "./+types/bench.runs.edit";

// /bench/runs/new (with ?rig=&protocol= once chosen) and /bench/runs/:id/edit, for the rig's owner only.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const units = await unitsFor(request);
  const url = new URL(request.url);
  const target =
    params.id != null
      ? { runId: parseIdParam(params.id, "No such bench run") }
      : { rigId: parseIdSearchParam(request, "rig"), protocolRef: url.searchParams.get("protocol") };
  try {
    return await benchEditorData(db, user.id, units, target);
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const [units, formData] = await Promise.all([unitsFor(request), readForm(request)]);
  const runId = params.id != null ? parseIdParam(params.id, "No such bench run") : null;
  try {
    return await benchEditorAction(db, user.id, units, formData, runId);
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}

export default function BenchRunEditor({ loaderData, actionData }: Route.ComponentProps) {
  const { rig, protocol, refusal } = loaderData;
  const failed = actionData && "errors" in actionData ? actionData : null;
  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-bold">
          {loaderData.runId ? `Edit bench run ${loaderData.runId}` : "File a bench run"}
        </h1>
        <p className="text-stone-700">
          Type each blow's peak, or upload the trial's raw trace (CSV: time in seconds, value) and check the preview.
          The run goes to a moderator before it is published.
        </p>
      </header>
      <BenchSafetyCautions />
      {!rig || !protocol ? (
        <RunChooser rigs={loaderData.rigs} protocols={loaderData.protocols} rigId={rig?.id ?? null} />
      ) : refusal ? (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {refusal}
        </p>
      ) : (
        <BenchRunForm
          runId={loaderData.runId}
          rig={rig}
          protocol={protocol}
          models={loaderData.models}
          units={loaderData.units}
          values={failed ? textValues(failed.values) : loaderData.values}
          errors={failed?.errors ?? {}}
          formError={failed?.formError}
        />
      )}
    </div>
  );
}

/** The typed values sent back with a 400, as text for the fields. */
const textValues = (values: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(values).map(([k, v]) => [k, typeof v === "string" ? v : ""]));

export function meta() {
  return [{ title: "File a bench run — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
