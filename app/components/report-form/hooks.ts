// The report form's behaviour in the browser: conform with the shared schema, autosave a moment
// after each change, and the form kept on the device until it is sent.
import { type SubmissionResult, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { type FocusEvent, type FormEvent, type RefObject, useEffect, useRef, useState } from "react";
import { useFetcher, useLocation } from "react-router";
import { z } from "zod";
import { reportSchema } from "~/reports/form-schema";
import { differsFromSaved, type OfflineDraft, offlineDraftKey } from "~/reports/offline-draft";

export type ReportInput = z.input<typeof reportSchema>;
export type ReportFields = ReturnType<typeof useForm<ReportInput>>[1];

const intentOf = (formData: FormData) => {
  const intent = formData.get("intent");
  return typeof intent === "string" ? intent : "";
};
const UNCHECKED_INTENTS = new Set(["withdraw", "save-draft"]);
const AUTOSAVE_DELAY_MS = 1200;

/**
 * conform over the report schema. Nothing is checked while the reporter merely moves through the
 * form: a field is checked when it is left after a real edit (see useEditedFieldCheck) and every
 * field on submit, then again as it is typed into.
 */
export function useReportConform(
  reportId: number | null,
  values: Record<string, string>,
  lastResult: SubmissionResult<string[]> | undefined,
) {
  return useForm<ReportInput>({
    id: `report-${reportId ?? "new"}`,
    lastResult,
    defaultValue: values,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    // Withdrawing and saving a draft take the form as it is: only submitting checks every field.
    onValidate: ({ formData }) =>
      UNCHECKED_INTENTS.has(intentOf(formData))
        ? parseWithZod(formData, { schema: reportSchema.or(z.any()) as unknown as typeof reportSchema })
        : parseWithZod(formData, { schema: reportSchema }),
  });
}

/** The tool box's typed text stands for the hidden tool field when it comes to checking. */
const CHECKED_AS: Record<string, string> = { toolQuery: "toolModel" };

/**
 * Checks a field when focus leaves it after the reporter changed it (typed, picked, ticked), so
 * tabbing through empty fields marks nothing. Spread onto the form.
 */
export function useEditedFieldCheck(validate: (name: string) => void) {
  const edited = useRef(new Set<string>());
  const nameOf = (target: EventTarget) =>
    target instanceof HTMLInputElement || target instanceof HTMLSelectElement || target instanceof HTMLTextAreaElement
      ? target.name
      : "";
  return {
    onInputCapture: (event: FormEvent) => {
      const name = nameOf(event.target);
      if (name) edited.current.add(name);
    },
    onBlurCapture: (event: FocusEvent) => {
      const name = nameOf(event.target);
      if (!name || !edited.current.has(name)) return;
      // Focus moving to another radio of the same group is not leaving the field.
      if (event.relatedTarget && nameOf(event.relatedTarget) === name) return;
      edited.current.delete(name);
      validate(CHECKED_AS[name] ?? name);
    },
  };
}

/** Whether a submit event is one of conform's own (a field check), not the reporter sending the form. */
export const isConformIntent = (event: FormEvent<HTMLFormElement>) =>
  ((event.nativeEvent as SubmitEvent).submitter as HTMLButtonElement | null)?.name === "__intent__";

type AutosaveReply =
  { autosaved: true; reportId: number; savedAt: string } | { autosaved: false; error: string } | { result: unknown };

/** Saves the form as a draft a moment after the last change, once it names the tool and the job. */
export function useAutosave(initialReportId: number | null, formRef: RefObject<HTMLFormElement | null>) {
  const fetcher = useFetcher<AutosaveReply>();
  const action = useLocation().pathname;
  const [reportId, setReportId] = useState(initialReportId);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);

  useEffect(() => {
    const d = fetcher.data;
    if (d && "autosaved" in d && d.autosaved) {
      setReportId(d.reportId);
      setSavedAt(d.savedAt);
    }
  }, [fetcher.data]);
  // A pending autosave must not fire after the report was sent or the page left.
  useEffect(() => () => clearTimeout(timer.current), []);

  function schedule(values: Record<string, string>) {
    clearTimeout(timer.current);
    if (!values.toolModel || !values.jobType) return;
    timer.current = setTimeout(() => {
      if (!formRef.current) return;
      const body = new FormData(formRef.current);
      body.set("intent", "autosave");
      void fetcher.submit(body, { method: "post", action });
    }, AUTOSAVE_DELAY_MS);
  }
  return { reportId, savedAt, schedule, cancel: () => clearTimeout(timer.current) };
}

/**
 * Keeps the form on this device and offers a kept one back, once, when the page opens. A new form
 * is kept under "new" until its first save gives it a number, then under that number: reopening
 * /reports/new then continues the saved draft (listed by the server) instead of a copy of it.
 */
export function useOfflineDraft(reportId: number | null, saved: Record<string, string>) {
  const key = offlineDraftKey(reportId);
  const [opened] = useState(saved);
  const [offer, setOffer] = useState<OfflineDraft | null>(null);
  useEffect(() => {
    const raw = localStorage.getItem(key);
    if (!raw) return;
    try {
      const kept = JSON.parse(raw) as OfflineDraft;
      const savedElsewhere = reportId === null && Boolean(kept.values.reportId);
      if (!savedElsewhere && differsFromSaved(kept, opened)) setOffer(kept);
    } catch {
      localStorage.removeItem(key);
    }
  }, [key, opened, reportId]);
  return {
    offer,
    keep: (values: Record<string, string>) => {
      const savedAs = reportId ?? (Number(values.reportId) || null);
      if (savedAs !== reportId) localStorage.removeItem(key);
      localStorage.setItem(
        offlineDraftKey(savedAs),
        JSON.stringify({ at: new Date().toISOString(), values } satisfies OfflineDraft),
      );
    },
    discard: () => {
      localStorage.removeItem(key);
      setOffer(null);
    },
    dismiss: () => setOffer(null),
  };
}

/** The form's current values by name. */
export function formEntries(form: HTMLFormElement): Record<string, string> {
  return Object.fromEntries([...new FormData(form)].map(([k, v]) => [k, typeof v === "string" ? v : v.name]));
}

/** Puts values into the form's fields as if typed (radios and checkboxes by value; hidden and read-only fields kept). */
export function fillForm(form: HTMLFormElement, values: Record<string, string>) {
  for (const [name, value] of Object.entries(values)) {
    for (const node of form.querySelectorAll<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>(
      `[name="${name}"]`,
    )) {
      if (node instanceof HTMLInputElement && (node.type === "radio" || node.type === "checkbox"))
        node.checked = node.value === value;
      else if (!(node instanceof HTMLInputElement && (node.type === "hidden" || node.readOnly))) node.value = value;
      node.dispatchEvent(new Event("input", { bubbles: true }));
      node.dispatchEvent(new Event("change", { bubbles: true }));
    }
  }
}
