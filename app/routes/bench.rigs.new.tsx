import { redirect } from "react-router";
import { requireUser } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { rigSchema } from "~/bench/rig-form";
import { checkToolChoices, registerRig } from "~/bench/rig-registry.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { RigRegisterForm } from "~/components/bench/rig-register-form";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { AppError, failureAnswer } from "~/utils/errors";
import { invalid, parseForm, readForm } from "~/utils/forms";
import type { Route } from "./+types/bench.rigs.new";

// /bench/rigs/new: any signed-in user registers a rig of their own.
export async function loader({ request }: Route.LoaderArgs) {
  await requireUser(request);
  const [units, tools] = await Promise.all([unitsFor(request), checkToolChoices(db)]);
  return { units, tools };
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const [units, formData] = await Promise.all([unitsFor(request), readForm(request)]);
  const parsed = parseForm(rigSchema(units), formData);
  if (!parsed.ok) return invalid(parsed.errors, parsed.values, "Some values need a look; they are marked below.");
  try {
    const id = await registerRig(db, user.id, parsed.data);
    return redirect(`/bench/rigs/${id}`);
  } catch (error) {
    if (error instanceof AppError && error.status === 400)
      return invalid(error.field ? { [error.field]: [error.message] } : {}, parsed.values, error.message);
    throw failureAnswer(error, "page");
  }
}

export default function RegisterRig({ loaderData, actionData }: Route.ComponentProps) {
  const failed = actionData && "errors" in actionData ? actionData : null;
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-2xl font-bold">Register your rig</h1>
        <p className="text-stone-700">
          A rig's runs count once its calibration is filed and verified by a moderator. Register the rig first, then
          file its calibration from the rig's page.
        </p>
      </header>
      <BenchSafetyCautions />
      <RigRegisterForm
        tools={loaderData.tools}
        units={loaderData.units}
        values={failed ? textValues(failed.values) : {}}
        errors={failed?.errors ?? {}}
        formError={failed?.formError}
      />
    </div>
  );
}

const textValues = (values: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(values).map(([k, v]) => [k, typeof v === "string" ? v : ""]));

export function meta() {
  return [{ title: "Register your rig — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
