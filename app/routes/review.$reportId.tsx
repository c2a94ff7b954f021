import { data, Form, Link, useNavigation } from "react-router";
import { requireRole } from "~/auth/session.server";
import { FITTING_LABELS, formatDate, formatDuration, formatHoseId, formatPressure, INLET_SOURCE_LABELS, lpsToScfm, OUTCOME_LABELS, toolName, VEHICLE_LABELS } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { SafetyCautions } from "~/components/safety-cautions";
import { db } from "~/db.server";
import { decisionSchema } from "~/moderation/decision-form";
import { claim, decide, DecisionError, reportLog } from "~/moderation/decide.server";
import { FLAG_EXPLANATIONS, type FlagCode } from "~/moderation/flags";
import { changesSinceLastVersion, reviewDetail } from "~/moderation/queue.server";
import { CHECKLIST, type ChecklistKey, REASONS } from "~/moderation/reasons";
import { LogList } from "~/components/decision-log";
import { TRUST_LABELS } from "~/moderation/trust";
import { formValues, readForm } from "~/utils/forms";
import { idField, parseIdParam } from "~/utils/params";
import type { Route } from "./+types/review.$reportId";

export async function loader({ request, params }: Route.LoaderArgs) {
  const moderator = await requireRole(request, "moderator");
  const id = parseIdParam(params.reportId, "No such report");
  const detail = await reviewDetail(db, id);
  if (!detail) throw data("No such report", { status: 404 });
  const own = detail.report.reporter_id === moderator.id;
  const claimState = own ? null : await claim(db, moderator.id, id);
  const log = await reportLog(db, id);
  const seenDecisions = log.filter((d) => ["accept", "return", "reject"].includes(d.action)).length;
  return {
    ...detail,
    own,
    claim: claimState,
    log,
    seenDecisions,
    changes: changesSinceLastVersion(detail.versions as never),
    units: { pu: moderator.pressureUnit, lu: moderator.lengthUnit },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const moderator = await requireRole(request, "moderator");
  const id = parseIdParam(params.reportId, "No such report");
  const form = await readForm(request);
  const values = formValues(form);
  const parsed = decisionSchema.safeParse(values);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return data({ ok: false as const, message: issue.message, field: String(issue.path[0] ?? ""), note: typeof values.note === "string" ? values.note : "" }, { status: 400 });
  }
  const checklist = Object.fromEntries(Object.keys(CHECKLIST).map((k) => [k, form.get(`check_${k}`) === "on"])) as Record<ChecklistKey, boolean>;
  const evidence: Record<number, "verified" | "failed"> = {};
  for (const [k, v] of form) {
    const m = k.match(/^evidence_(.*)$/);
    if (!m) continue;
    const evidenceId = idField().safeParse(m[1]);
    if (!evidenceId.success || (v !== "verified" && v !== "failed")) {
      return data({ ok: false as const, message: "Mark each file verified or failed" }, { status: 400 });
    }
    evidence[evidenceId.data] = v;
  }
  try {
    const result = await decide(db, moderator.id, id, { ...parsed.data, note: parsed.data.note ?? null, checklist, evidence });
    return { ok: true as const, message: result.outcome === "awaiting_second_look" ? "Accepted; it now needs a second look from another moderator." : `Decision recorded: ${result.outcome}. The reporter is told by mail.` };
  } catch (error) {
    if (error instanceof DecisionError) return data({ ok: false as const, message: error.message }, { status: error.status });
    throw error;
  }
}

export default function ReviewReport({ loaderData, actionData }: Route.ComponentProps) {
  const { report: r, media, usual, trust, own, claim, log, seenDecisions, changes, units } = loaderData;
  const busy = useNavigation().state !== "idle";
  const noteError = actionData && !actionData.ok && "field" in actionData && actionData.field === "note" ? actionData.message : undefined;
  const p = (kpa: number | null) => formatPressure(kpa, units.pu);
  const waiting = r.status === "submitted";
  const canDecide = waiting && !own && claim?.mine;
  const accepts = log.filter((d) => d.action === "accept" && d.report_version === r.version).length;
  const rows: [string, string][] = [
    ["Tool", `${toolName(r.maker, r.model_code)} (${r.category})`], ["Job", r.job],
    ["Vehicle", VEHICLE_LABELS[r.vehicle_class ?? ""] ?? "—"], ["Part age", r.component_age_years == null ? "—" : `${r.component_age_years} years`],
    ["Corrosion", r.corrosion_level ?? "—"], ["Bit or socket", `${r.attachment ?? "—"}${r.attachment_length_mm ? `, ${Math.round(r.attachment_length_mm)} mm` : ""}`],
    ["Regulator", p(r.regulator_kpa)], ["At the tool inlet", `${p(r.inlet_kpa)} (${INLET_SOURCE_LABELS[r.inlet_source ?? ""] ?? "—"})`],
    ["Hose", `${formatHoseId(r.hose_id_mm, units.lu)} × ${r.hose_length_m?.toFixed(1) ?? "—"} m`],
    ["Couplers", `${r.coupler_count ?? "—"} × ${r.coupler_profile?.replaceAll("_", " ") ?? "unknown"}`],
    ["Compressor", r.compressor_lps == null ? "—" : `${r.compressor_lps.toFixed(1)} l/s (${lpsToScfm(r.compressor_lps).toFixed(1)} SCFM)`],
    ["Tank", r.tank_l == null ? "—" : `${Math.round(r.tank_l)} l`],
    ["Outcome", OUTCOME_LABELS[r.outcome ?? ""] ?? "—"], ["Time to result", formatDuration(r.time_to_result_s)],
    ["Attempts", String(r.attempts ?? "—")], ["Trigger control", r.trigger_control ? `${r.trigger_control} of 5` : "—"],
  ];
  return (
    <div className="space-y-5">
      <header>
        <p className="text-sm"><Link to="/review" className="text-bay-700 underline">← Queue</Link></p>
        <h1 className="text-2xl font-bold">Report #{r.id} · {toolName(r.maker, r.model_code)} · {r.job}</h1>
        <p className="text-sm text-stone-600">
          By {r.reporter} ({TRUST_LABELS[trust]}) · submitted {formatDate(r.submitted_at)} · version {r.version} · status {r.status}
          {accepts > 0 && waiting ? ` · accepted once, waiting for a second look` : ""}
        </p>
        {own && <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">This is your own report: you cannot decide on it.</p>}
        {claim && !claim.mine && claim.holder && (
          <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">{claim.holder} has this report open until {new Date(claim.expiresAt!).toLocaleTimeString()}. You can read it; deciding waits.</p>
        )}
        {claim?.mine && <p className="mt-2 text-sm text-stone-600">Held for you until {new Date(claim.expiresAt!).toLocaleTimeString()}.</p>}
        {claim && "alreadyAccepted" in claim && waiting && <p className="mt-2 text-sm text-stone-600">You accepted this version; the second look is another moderator's.</p>}
      </header>

      {actionData && (
        <p role={actionData.ok ? "status" : "alert"} className={`rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}>{actionData.message}</p>
      )}

      {r.flags.length > 0 && (
        <section className="rounded-lg border border-amber-300 bg-amber-50 p-3">
          <h2 className="font-semibold">Flags</h2>
          <ul className="mt-1 space-y-1 text-sm">
            {r.flags.map((f) => <li key={f}><span className="font-semibold">⚑ {f.replaceAll("_", " ")}</span> — {FLAG_EXPLANATIONS[f as FlagCode] ?? ""}</li>)}
          </ul>
          {r.flags.includes("above_rated_inlet") && <div className="mt-2"><SafetyCautions action={r.category_action} /></div>}
        </section>
      )}

      <div className="grid gap-5 lg:grid-cols-2">
        <section className="space-y-3" aria-labelledby="evidence-heading">
          <h2 id="evidence-heading" className="text-lg font-semibold">Evidence</h2>
          {media.length === 0 && <p className="text-stone-600">No evidence attached.</p>}
          {media.map((m) => (
            <figure key={m.id} className="rounded-lg border border-stone-200 bg-white p-2">
              {m.kind === "video"
                ? <video src={m.url} controls preload="metadata" className="w-full rounded bg-black" data-testid={`video-${m.id}`} />
                : <img src={m.url} alt={`Evidence photo ${m.id}`} className="w-full rounded" />}
              <figcaption className="mt-1 text-xs text-stone-600">
                {m.contentType} · {m.size ? `${(m.size / 1024 / 1024).toFixed(1)} MB` : "—"} · SHA-256 {m.sha256?.slice(0, 12)}… · {m.status.replaceAll("_", " ")}
              </figcaption>
            </figure>
          ))}
        </section>
        <section aria-labelledby="fields-heading">
          <h2 id="fields-heading" className="text-lg font-semibold">What was reported</h2>
          <dl className="mt-2 divide-y divide-stone-100 rounded-lg border border-stone-200 bg-white text-sm">
            {rows.map(([k, v]) => <div key={k} className="flex justify-between gap-3 px-3 py-1.5"><dt className="text-stone-600">{k}</dt><dd className="text-right">{v}</dd></div>)}
          </dl>
          {r.notes && <p className="mt-2 whitespace-pre-wrap rounded bg-white p-3 text-sm">{r.notes}</p>}
          <h3 className="mt-4 font-semibold">The tool's specifications</h3>
          <p className="text-sm text-stone-700">
            {FITTING_LABELS[r.fitting]} · {r.weight_kg} kg · rated air {r.rated_air_lps} l/s · max inlet {p(r.max_inlet_kpa)}
            {r.blows_per_minute ? ` · ${r.blows_per_minute} bpm` : ""}{r.max_torque_nm ? ` · ${r.max_torque_nm} N·m` : ""}
          </p>
          <h3 className="mt-3 font-semibold">Usual for this job ({usual.n} accepted reports)</h3>
          <p className="text-sm text-stone-700">
            Time: {formatDuration(usual.time_q1)}–{formatDuration(usual.time_q3)} (middle half; median {formatDuration(usual.time_median)}) ·
            inlet {p(usual.inlet_q1)}–{p(usual.inlet_q3)}
          </p>
          {changes.length > 0 && (
            <>
              <h3 className="mt-3 font-semibold">Changed since the previous version</h3>
              <ul className="text-sm">
                {changes.map((c) => <li key={c.field}><span className="font-semibold">{c.field.replaceAll("_", " ")}</span>: {String(c.before ?? "—")} → {String(c.after ?? "—")}</li>)}
              </ul>
            </>
          )}
        </section>
      </div>

      {canDecide && (
        <Form method="post" className="space-y-4 rounded-lg border border-bay-600 bg-white p-4">
          <input type="hidden" name="version" value={r.version} />
          <input type="hidden" name="seenDecisions" value={seenDecisions} />
          <fieldset>
            <legend className="font-semibold">Evidence checklist</legend>
            {Object.entries(CHECKLIST).map(([k, label]) => (
              <label key={k} className="mt-1 flex items-center gap-3 py-1"><input type="checkbox" name={`check_${k}`} className="h-5 w-5" /> {label}</label>
            ))}
          </fieldset>
          {media.length > 0 && (
            <fieldset>
              <legend className="font-semibold">Each file</legend>
              {media.map((m, i) => (
                <div key={m.id} className="mt-1 flex flex-wrap items-center gap-4 text-sm">
                  <span>File {i + 1} ({m.kind})</span>
                  <label className="flex items-center gap-2"><input type="radio" name={`evidence_${m.id}`} value="verified" defaultChecked={m.status === "verified"} /> verified</label>
                  <label className="flex items-center gap-2"><input type="radio" name={`evidence_${m.id}`} value="failed" defaultChecked={m.status === "failed_verification"} /> failed verification</label>
                </div>
              ))}
            </fieldset>
          )}
          <fieldset>
            <legend className="font-semibold">Decision</legend>
            <div className="mt-1 grid gap-3 sm:grid-cols-3">
              {(Object.keys(REASONS) as (keyof typeof REASONS)[]).map((action) => (
                <label key={action} className="block rounded border border-stone-300 p-2">
                  <span className="flex items-center gap-2 font-semibold"><input type="radio" name="action" value={action} /> {action === "accept" ? "Accept" : action === "return" ? "Return for changes" : "Reject"}</span>
                </label>
              ))}
            </div>
          </fieldset>
          <label className="block">
            <span className="font-semibold">Reason</span>
            <select name="reasonCode" defaultValue="" className="mt-1 block w-full rounded border border-stone-300 px-3 py-3">
              <option value="">— pick the reason —</option>
              {Object.entries(REASONS).map(([action, group]) => (
                <optgroup key={action} label={action === "accept" ? "Accept" : action === "return" ? "Return" : "Reject"}>
                  {Object.entries(group).map(([code, label]) => <option key={code} value={code}>{label}</option>)}
                </optgroup>
              ))}
            </select>
          </label>
          <label className="block">
            <span className="font-semibold">Note to the reporter</span>
            <textarea name="note" rows={3} defaultValue={actionData && "note" in actionData ? String(actionData.note) : undefined}
              aria-invalid={noteError ? true : undefined} aria-describedby={noteError ? "note-error" : undefined}
              className="mt-1 block w-full rounded border border-stone-300 px-3 py-2" placeholder="For a return: what to change" />
            {noteError && <span id="note-error" className="mt-1 block text-sm text-red-700">{noteError}</span>}
          </label>
          <button type="submit" disabled={busy} className="rounded bg-bay-700 px-5 py-3 font-semibold text-white">Record the decision</button>
        </Form>
      )}

      <section aria-labelledby="log-heading">
        <h2 id="log-heading" className="text-lg font-semibold">History</h2>
        <LogList log={log} />
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `Review #${data.report.id} — Bayproof` : "Review — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
