import { data, redirect, type ShouldRevalidateFunctionArgs } from "react-router";
import { requireUser } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { ReportEditor } from "~/components/report-form/report-editor";
import { db } from "~/db.server";
import { editReport, loadEditor } from "~/reports/editor.server";
import { ReportError } from "~/reports/reports.server";
import { readForm } from "~/utils/forms";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/reports.edit";

const NOT_FOUND = "No such report among yours";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const id = params.id === undefined ? null : parseIdParam(params.id, NOT_FOUND);
  return loadEditor(db, user, id).catch(refused);
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const pathId = params.id === undefined ? undefined : parseIdParam(params.id, NOT_FOUND);
  const answer = await editReport(db, user.id, pathId, await readForm(request)).catch(refused);
  switch (answer.kind) {
    case "redirect":
      return redirect(answer.to);
    case "autosaved":
      return { autosaved: true as const, reportId: answer.reportId, savedAt: answer.savedAt };
    case "autosave-failed":
      return data({ autosaved: false as const, error: answer.error }, { status: answer.status });
    case "invalid":
      return data({ result: answer.result }, { status: answer.status });
  }
}

// Autosaves change nothing the page shows; skip reloading its data after each one.
export function shouldRevalidate({ formData, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  return formData?.get("intent") === "autosave" ? false : defaultShouldRevalidate;
}

// One editor per report: going from /reports/new to a draft (or back) starts afresh, not with the
// other report's state.
export default function ReportEditorPage(props: Route.ComponentProps) {
  const { loaderData, actionData } = props;
  return (
    <ReportEditor
      key={loaderData.reportId ?? "new"}
      loaderData={loaderData}
      lastResult={actionData && "result" in actionData ? actionData.result : undefined}
    />
  );
}

/** A refusal the page shows as an error page. */
function refused(error: unknown): never {
  if (error instanceof ReportError) throw data(error.message, { status: error.status });
  throw error;
}

export function meta() {
  return [{ title: "File a report — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
