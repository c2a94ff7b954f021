import { data, Form, useNavigation } from "react-router";
import { z } from "zod";
import { requireRole } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { JobTable } from "~/components/admin/job-table";
import { buttonClass } from "~/components/ui";
import { db } from "~/db.server";
import { sendAgain, stuckJobs } from "~/jobs/stuck.server";
import { parseForm } from "~/utils/forms";
import type { Route } from "./+types/admin.jobs";

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "admin");
  const jobs = await stuckJobs(db);
  return { failed: jobs.filter((j) => j.state === "failed"), retrying: jobs.filter((j) => j.state === "retry") };
}

const sendAgainSchema = z.object({ intent: z.literal("send-again"), jobId: z.uuid() });

export async function action({ request }: Route.ActionArgs) {
  const admin = await requireRole(request, "admin");
  const form = parseForm(sendAgainSchema, await request.formData());
  if (!form.ok) return data({ ok: false as const, message: "That is not a job on this page." }, { status: 400 });
  const result = await sendAgain(db, form.data.jobId);
  if (!result.ok) return data({ ok: false as const, message: result.message }, { status: result.status });
  console.info(`[admin] ${admin.handle} sent job ${form.data.jobId} again as ${result.newId}`);
  return { ok: true as const, message: "Sent again: it is back in the queue with its full retry schedule." };
}

export default function AdminJobs({ loaderData, actionData }: Route.ComponentProps) {
  const { failed, retrying } = loaderData;
  const busy = useNavigation().state !== "idle";
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-bold">Stuck work</h1>
        <p className="max-w-prose text-stone-700">
          Background work that failed every try — mail that never reached the relay, stats or search updates that kept
          erroring. Fix the cause (a relay that is down, say), then send it again. Work still being retried is listed
          below it.
        </p>
      </header>
      {actionData && (
        <p
          role={actionData.ok ? "status" : "alert"}
          className={`rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}
        >
          {actionData.message}
        </p>
      )}
      <section aria-labelledby="failed-heading" className="space-y-2">
        <h2 id="failed-heading" className="text-lg font-semibold">
          Failed ({failed.length})
        </h2>
        {failed.length === 0 ? (
          <p className="text-stone-600">Nothing is stuck.</p>
        ) : (
          <JobTable
            label="Failed work"
            jobs={failed}
            when="Gave up"
            action={(id) => (
              <Form method="post">
                <input type="hidden" name="jobId" value={id} />
                <button
                  type="submit"
                  name="intent"
                  value="send-again"
                  disabled={busy}
                  className={buttonClass("primary", "sm")}
                >
                  Send again
                </button>
              </Form>
            )}
          />
        )}
      </section>
      <section aria-labelledby="retrying-heading" className="space-y-2">
        <h2 id="retrying-heading" className="text-lg font-semibold">
          Waiting for another try ({retrying.length})
        </h2>
        {retrying.length === 0 ? (
          <p className="text-stone-600">None.</p>
        ) : (
          <JobTable label="Work waiting for another try" jobs={retrying} when="Next try" />
        )}
      </section>
    </div>
  );
}

export function meta() {
  return [{ title: "Stuck work — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
