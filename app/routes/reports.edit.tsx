import { getFormProps, getInputProps, getSelectProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useEffect, useRef, useState } from "react";
import { data, Form, redirect, type ShouldRevalidateFunctionArgs, useFetcher, useLocation, useNavigation } from "react-router";
import { z } from "zod";
import { requireUser } from "~/auth/session.server";
import { CORROSION_LEVELS, COUPLER_LABELS, COUPLER_PROFILES, INLET_SOURCE_CHOICES, OUTCOME_CHOICES, pressureToKpa, VEHICLE_CLASSES, VEHICLE_LABELS } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { EvidenceUploader, type EvidenceItem } from "~/components/report-form/evidence-uploader";
import { ToolPicker, type ToolChoice } from "~/components/report-form/tool-picker";
import { SafetyCautions } from "~/components/safety-cautions";
import { db } from "~/db.server";
import { parseDraft, reportSchema, toFormValues } from "~/reports/form-schema";
import { EDITABLE } from "~/reports/status";
import { findModel, getOwnReport, jobTypesByCategory, recentSupplies, ReportError, saveDraft, submitReport, suggestModels, withdrawReport } from "~/reports/reports.server";
import { readForm } from "~/utils/forms";
import { groupBy } from "~/utils/group";
import { idField, parseIdParam } from "~/utils/params";
import { hasControlCharacters } from "~/utils/text";
import type { Route } from "./+types/reports.edit";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const pu = user.pressureUnit;
  const lu = user.lengthUnit;
  let values: Record<string, string> = { pu, lu };
  let tool: ToolChoice | null = null;
  let reportId: number | null = null;
  let evidence: EvidenceItem[] = [];
  let status: string = "new";
  if (params.id !== undefined) {
    const id = parseIdParam(params.id, "No such report among yours");
    const own = await getOwnReport(db, user.id, id).catch((e) => {
      if (e instanceof ReportError) throw data(e.message, { status: e.status });
      throw e;
    });
    if (!EDITABLE.includes(own.report.status)) throw data("This report is submitted or decided and can no longer be edited. Withdraw it from your reports first if it is still waiting.", { status: 409 });
    values = { ...toFormValues(own.report, pu, lu), toolModel: own.modelSlug, jobType: own.jobSlug };
    const model = await findModel(db, own.modelSlug);
    tool = model ? { slug: model.slug, label: own.modelLabel, categorySlug: "", action: model.action, maxInletKpa: model.max_inlet_kpa } : null;
    reportId = own.report.id;
    status = own.report.status;
    evidence = (await db.selectFrom("evidence").select(["id", "kind", "content_type", "size_bytes", "status", "is_public"])
      .where("report_id", "=", reportId).where("status", "!=", "pending").execute())
      .map((e) => ({ id: e.id, kind: e.kind, contentType: e.content_type, size: e.size_bytes == null ? null : Number(e.size_bytes), status: e.status, isPublic: e.is_public }));
  }
  const [jobs, supplies] = await Promise.all([jobTypesByCategory(db), recentSupplies(db, user.id)]);
  if (tool && params.id !== undefined) {
    const cat = jobs.find((j) => j.slug === values.jobType)?.category_slug ?? "";
    tool = { ...tool, categorySlug: cat };
  }
  return {
    reportId, status, tool, values, jobs, pu, lu, evidence,
    supplies: supplies.map((s) => {
      const v = toFormValues({ ...s }, pu, lu);
      return { regulator: v.regulator, hoseId: v.hoseId, hoseLength: v.hoseLength, couplerProfile: v.couplerProfile, couplerCount: v.couplerCount, compressor: v.compressor, tank: v.tank };
    }),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const pathId = params.id === undefined ? undefined : parseIdParam(params.id, "No such report among yours");
  const formData = await readForm(request);
  const intent = String(formData.get("intent") ?? "submit");
  const field = formData.get("reportId");
  const reportId = field ? idField().safeParse(field) : null;
  if (reportId && !reportId.success) throw data("The report number sent with the form is not valid; reload the page", { status: 400 });
  const id = reportId?.data ?? pathId;

  // Without JavaScript the tool is typed, not picked: accept it when it names exactly one model.
  const toolQuery = formData.get("toolQuery");
  if (!formData.get("toolModel") && typeof toolQuery === "string" && toolQuery && !hasControlCharacters(toolQuery)) {
    const hits = await suggestModels(db, toolQuery.slice(0, 80), 2);
    if (hits.length === 1) formData.set("toolModel", hits[0]!.slug);
  }

  try {
    if (intent === "withdraw") {
      if (!id) throw data("Nothing to withdraw yet", { status: 400 });
      await withdrawReport(db, user.id, id);
      return redirect("/me/reports?withdrawn=1");
    }
    if (intent === "autosave" || intent === "save-draft") {
      const draft = parseDraft(Object.fromEntries(formData));
      const saved = await saveDraft(db, user.id, id, draft);
      if (intent === "save-draft") return redirect(`/reports/${saved}/edit?saved=1`);
      return { autosaved: true as const, reportId: saved, savedAt: new Date().toISOString() };
    }
    const submission = parseWithZod(formData, { schema: reportSchema });
    if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
    const done = await submitReport(db, user.id, id, submission.value);
    return redirect(`/me/reports?submitted=${done.id}`);
  } catch (error) {
    if (error instanceof ReportError) {
      if (intent === "autosave") return data({ autosaved: false as const, error: error.message }, { status: error.status });
      if (error.field) {
        const submission = parseWithZod(formData, { schema: reportSchema });
        return data({ result: submission.reply({ fieldErrors: { [error.field]: [error.message] } }) }, { status: error.status });
      }
      throw data(error.message, { status: error.status });
    }
    throw error;
  }
}

// Autosaves change nothing the page shows; skip reloading its data after each one.
export function shouldRevalidate({ formData, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  return formData?.get("intent") === "autosave" ? false : defaultShouldRevalidate;
}

const input = "mt-1 block w-full rounded border border-stone-300 px-3 py-3 text-base aria-[invalid]:border-red-600";
const section = "space-y-4 rounded-lg border border-stone-200 bg-white p-4";
const UNCHECKED_INTENTS = new Set(["withdraw", "save-draft"]);
const STORAGE_KEY = (id: number | null) => `bayproof:report-form:${id ?? "new"}`;

export default function ReportEditor({ loaderData, actionData }: Route.ComponentProps) {
  const { jobs, pu, lu, supplies, status, evidence } = loaderData;
  const metric = lu === "mm";
  const [reportId, setReportId] = useState<number | null>(loaderData.reportId);
  const [tool, setTool] = useState<ToolChoice | null>(loaderData.tool);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [inletTyped, setInletTyped] = useState<string>(loaderData.values.inlet ?? "");
  const [offer, setOffer] = useState<{ at: string; values: Record<string, string> } | null>(null);
  const autosave = useFetcher<typeof action>();
  const navigation = useNavigation();
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  const formAction = useLocation().pathname;

  const [form, fields] = useForm<z.input<typeof reportSchema>>({
    id: `report-${loaderData.reportId ?? "new"}`,
    lastResult: actionData && "result" in actionData ? actionData.result : undefined,
    defaultValue: loaderData.values as Record<string, unknown>,
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
    // Withdrawing and saving a draft take the form as it is: only submitting checks every field.
    onValidate: ({ formData }) =>
      UNCHECKED_INTENTS.has(String(formData.get("intent")))
        ? parseWithZod(formData, { schema: reportSchema.or(z.any()) as unknown as typeof reportSchema })
        : parseWithZod(formData, { schema: reportSchema }),
  });

  useEffect(() => {
    const d = autosave.data;
    if (d && "autosaved" in d && d.autosaved) {
      setReportId(d.reportId);
      setSavedAt(d.savedAt);
    }
  }, [autosave.data]);

  // A form left unsent (the network dropped, the phone slept) is kept in the browser and offered
  // back once, when the page opens.
  useEffect(() => {
    const raw = localStorage.getItem(STORAGE_KEY(loaderData.reportId));
    if (!raw) return;
    try {
      const stored = JSON.parse(raw) as { at: string; values: Record<string, string> };
      const differs = Object.entries(stored.values).some(([k, v]) => v && (loaderData.values[k] ?? "") !== v && !["intent", "reportId", "pu", "lu"].includes(k));
      if (differs) setOffer(stored);
    } catch {
      localStorage.removeItem(STORAGE_KEY(loaderData.reportId));
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  function onChange() {
    const el = formRef.current;
    if (!el) return;
    const values = Object.fromEntries([...new FormData(el)].map(([k, v]) => [k, String(v)]));
    localStorage.setItem(STORAGE_KEY(loaderData.reportId), JSON.stringify({ at: new Date().toISOString(), values }));
    setInletTyped(values.inlet ?? "");
    clearTimeout(timer.current);
    if (!values.toolModel || !values.jobType) return;
    timer.current = setTimeout(() => {
      const body = new FormData(el);
      body.set("intent", "autosave");
      autosave.submit(body, { method: "post", action: formAction });
    }, 1200);
  }
  // A pending autosave must not fire after the report was sent or the page left.
  useEffect(() => () => clearTimeout(timer.current), []);

  function fill(values: Record<string, string>) {
    const el = formRef.current;
    if (!el) return;
    for (const [name, value] of Object.entries(values)) {
      for (const node of el.querySelectorAll<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>(`[name="${name}"]`)) {
        if (node instanceof HTMLInputElement && (node.type === "radio" || node.type === "checkbox")) node.checked = node.value === value;
        else if (!(node instanceof HTMLInputElement && node.type === "hidden")) node.value = value;
        node.dispatchEvent(new Event("input", { bubbles: true }));
        node.dispatchEvent(new Event("change", { bubbles: true }));
      }
    }
    onChange();
  }

  const jobOptions = groupBy(jobs.filter((j) => !tool?.categorySlug || j.category_slug === tool.categorySlug), (j) => j.category_name);
  const inletKpa = Number(inletTyped) > 0 ? pressureToKpa(Number(inletTyped), pu) : 0;
  const overRated = tool != null && inletKpa > tool.maxInletKpa + 15;
  const submitting = navigation.state === "submitting";
  const err = (name: keyof typeof fields) => fields[name].errors?.[0];

  return (
    <div className="mx-auto max-w-xl space-y-4">
      <header>
        <h1 className="text-2xl font-bold">{status === "returned" ? "Fix and resubmit your report" : "File a report from the bay"}</h1>
        <p className="text-sm text-stone-600">
          One job with one tool. Units follow your account ({pu}, {metric ? "mm and m" : "in and ft"}).{" "}
          {savedAt ? <span role="status">Draft saved {new Date(savedAt).toLocaleTimeString()}.</span> : reportId ? "Saved as a draft." : "Saved as a draft as soon as the tool and the job are picked."}
        </p>
      </header>

      {offer && (
        <div role="alert" className="rounded border border-signal-500 bg-signal-100 p-3 text-sm">
          <p>This device kept a form you had not sent ({new Date(offer.at).toLocaleString()}).</p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="rounded bg-bay-700 px-3 py-2 font-semibold text-white" onClick={() => { fill(offer.values); setOffer(null); }}>Restore it</button>
            <button type="button" className="rounded border border-stone-300 px-3 py-2" onClick={() => { localStorage.removeItem(STORAGE_KEY(loaderData.reportId)); setOffer(null); }}>Discard</button>
          </div>
        </div>
      )}

      <Form method="post" {...getFormProps(form)} ref={formRef} onChange={onChange} onSubmitCapture={() => clearTimeout(timer.current)} className="space-y-4">
        <input type="hidden" name="reportId" value={reportId ?? ""} />
        <input type="hidden" name="pu" value={pu} />
        <input type="hidden" name="lu" value={lu} />
        {form.errors && <p role="alert" className="text-sm text-red-700">{form.errors[0]}</p>}

        <fieldset className={section}>
          <legend className="px-1 text-lg font-semibold">Tool and job</legend>
          <ToolPicker initial={tool} error={err("toolModel")} onPick={(t) => { setTool(t); setTimeout(onChange, 0); }} />
          <label className="block">
            <span className="font-semibold">Job</span>
            <select {...getSelectProps(fields.jobType)} key={`job-${tool?.categorySlug ?? "all"}`} className={input}>
              <option value="">— pick the job —</option>
              {[...jobOptions].map(([category, list]) => (
                <optgroup key={category} label={category}>
                  {list.map((j) => <option key={j.slug} value={j.slug}>{j.name}</option>)}
                </optgroup>
              ))}
            </select>
            <FieldError message={err("jobType")} />
          </label>
          <div className="grid grid-cols-2 gap-3">
            <label className="block">
              <span className="font-semibold">Vehicle</span>
              <select {...getSelectProps(fields.vehicleClass)} className={input}>
                <option value="">—</option>
                {VEHICLE_CLASSES.map((v) => <option key={v} value={v}>{VEHICLE_LABELS[v]}</option>)}
              </select>
              <FieldError message={err("vehicleClass")} />
            </label>
            <label className="block">
              <span className="font-semibold">Corrosion</span>
              <select {...getSelectProps(fields.corrosion)} className={input}>
                <option value="">—</option>
                {CORROSION_LEVELS.map((c) => <option key={c} value={c}>{c}</option>)}
              </select>
              <FieldError message={err("corrosion")} />
            </label>
            <TextField label="Part age, years" field={fields.componentAge} inputMode="numeric" />
            <TextField label={`Bit or socket length, ${metric ? "mm" : "in"}`} field={fields.attachmentLength} inputMode="decimal" />
          </div>
          <TextField label="Bit or socket used" field={fields.attachment} placeholder="e.g. pickle fork, tapered punch" />
          {tool?.action === "percussive" && <SafetyCautions action="percussive" />}
        </fieldset>

        <fieldset className={section}>
          <legend className="px-1 text-lg font-semibold">Air supply</legend>
          {supplies.length > 0 && (
            <div>
              <p className="text-sm font-semibold">Your recent supplies — tap to reuse</p>
              <div className="mt-1 flex flex-wrap gap-2">
                {supplies.map((s, i) => (
                  <button key={i} type="button" onClick={() => fill(s as Record<string, string>)} className="rounded-full border border-bay-700 px-3 py-2 text-sm text-bay-700">
                    {s.regulator} {pu} · {s.hoseId} {metric ? "mm" : "in"} × {s.hoseLength} {metric ? "m" : "ft"}{s.couplerCount ? ` · ${s.couplerCount} couplers` : ""}
                  </button>
                ))}
              </div>
            </div>
          )}
          <div className="grid grid-cols-2 gap-3">
            <TextField label={`Regulator, ${pu}`} field={fields.regulator} inputMode="decimal" />
            <TextField label={`At the tool inlet, ${pu}`} field={fields.inlet} inputMode="decimal" />
          </div>
          <fieldset>
            <legend className="font-semibold">How did you get the inlet pressure?</legend>
            <RadioChoices field={fields.inletSource} labels={INLET_SOURCE_CHOICES} className="mt-1 grid gap-2" />
          </fieldset>
          {overRated && (
            <p role="alert" className="rounded border-l-4 border-red-600 bg-red-50 p-3 text-sm">
              That is above this tool's rated inlet pressure. Running a tool over its rating can break bits, retainers and the tool itself:
              follow the maker's instructions. The report will be flagged for the moderators.
            </p>
          )}
          <div className="grid grid-cols-2 gap-3">
            <TextField label={`Hose inside diameter, ${metric ? "mm" : "in"}`} field={fields.hoseId} placeholder={metric ? "9.5" : "3/8"} />
            <TextField label={`Hose length, ${metric ? "m" : "ft"}`} field={fields.hoseLength} inputMode="decimal" />
            <label className="block">
              <span className="font-semibold">Couplers</span>
              <select {...getSelectProps(fields.couplerProfile)} className={input}>
                <option value="">— profile —</option>
                {COUPLER_PROFILES.map((k) => <option key={k} value={k}>{COUPLER_LABELS[k]}</option>)}
              </select>
            </label>
            <TextField label="How many couplers" field={fields.couplerCount} inputMode="numeric" />
            <TextField label={`Compressor delivery, ${metric ? "l/s" : "SCFM"}`} field={fields.compressor} inputMode="decimal" />
            <TextField label={`Tank, ${metric ? "l" : "gal"}`} field={fields.tank} inputMode="decimal" />
          </div>
        </fieldset>

        <fieldset className={section}>
          <legend className="px-1 text-lg font-semibold">Result</legend>
          <RadioChoices field={fields.outcome} labels={OUTCOME_CHOICES} className="grid gap-2" />
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Time to result" field={fields.time} placeholder="45 s, 3 min, 1:30" />
            <TextField label="Attempts" field={fields.attempts} inputMode="numeric" />
          </div>
          <fieldset>
            <legend className="font-semibold">Trigger control (1 = hard to feather, 5 = easy)</legend>
            <div className="mt-1 flex gap-2">
              {[1, 2, 3, 4, 5].map((n) => (
                <label key={n} className="flex flex-1 items-center justify-center gap-2 rounded border border-stone-300 py-3">
                  <input {...getInputProps(fields.triggerControl, { type: "radio", value: String(n) })} className="h-5 w-5" /> {n}
                </label>
              ))}
            </div>
          </fieldset>
        </fieldset>

        <fieldset className={section}>
          <legend className="px-1 text-lg font-semibold">Evidence</legend>
          <EvidenceUploader reportId={reportId} initial={evidence} />
        </fieldset>

        <fieldset className={section}>
          <legend className="px-1 text-lg font-semibold">Notes</legend>
          <label className="block">
            <span className="sr-only">Notes</span>
            <textarea {...getTextareaProps(fields.notes)} rows={4} className={input} placeholder="Penetrant, heat, anything a moderator should know" />
            <FieldError message={err("notes")} />
          </label>
        </fieldset>

        <div className="sticky bottom-0 flex flex-col gap-2 bg-bay-50 py-3 sm:flex-row">
          <button type="submit" name="intent" value="submit" disabled={submitting} className="flex-1 rounded bg-bay-700 px-4 py-4 text-lg font-semibold text-white disabled:opacity-60">
            {submitting ? "Sending…" : status === "returned" ? "Resubmit" : "Submit report"}
          </button>
          <button type="submit" name="intent" value="save-draft" formNoValidate className="rounded border border-stone-400 px-4 py-4">Save draft</button>
          {reportId && (
            <button type="submit" name="intent" value="withdraw" formNoValidate className="rounded border border-stone-400 px-4 py-4">Withdraw</button>
          )}
        </div>
      </Form>
    </div>
  );
}

function FieldError({ message }: { message?: string }) {
  return message ? <span className="mt-1 block text-sm text-red-700">{message}</span> : null;
}

/** One radio per choice, in the order of `labels`, with the field's error below. */
function RadioChoices({ field, labels, className }: { field: Parameters<typeof getInputProps>[0]; labels: Record<string, string>; className: string }) {
  return (
    <>
      <div className={className}>
        {Object.entries(labels).map(([value, label]) => (
          <label key={value} className="flex items-center gap-3 rounded border border-stone-300 px-3 py-3">
            <input {...getInputProps(field, { type: "radio", value })} className="h-5 w-5" />
            <span>{label}</span>
          </label>
        ))}
      </div>
      <FieldError message={field.errors?.[0]} />
    </>
  );
}

function TextField({ label, field, ...rest }: { label: string; field: Parameters<typeof getInputProps>[0] } & React.InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className="block">
      <span className="font-semibold">{label}</span>
      <input {...getInputProps(field, { type: "text" })} {...rest} className={input} autoComplete="off" />
      <FieldError message={field.errors?.[0]} />
    </label>
  );
}

export function meta() {
  return [{ title: "File a report — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
