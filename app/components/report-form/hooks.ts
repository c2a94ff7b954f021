// The report form's behaviour in the browser: conform with the shared schema, autosave a moment
// after each change, and the form kept on the device until it is sent.
import { type SubmissionResult, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { type RefObject, useEffect, useRef, useState } from "react";
import { useFetcher, useLocation } from "react-router";
import { z } from "zod";
import { reportSchema } from "~/reports/form-schema";
import { differsFromSaved, type OfflineDraft, offlineDraftKey } from "~/reports/offline-draft";

export type ReportInput = z.input<typeof reportSchema>;
export type ReportFields = ReturnType<typeof useForm<ReportInput>>[1];

const UNCHECKED_INTENTS = new Set(["withdraw", "save-draft"]);
const AUTOSAVE_DELAY_MS = 1200;

/** conform over the report schema: checked on blur, then as the reporter types. */
export function useReportConform(reportId: number | null, values: Record<string, string>, lastResult: SubmissionResult<string[]> | undefined) {
  return useForm<ReportInput>({
    id: `report-${reportId ?? "new"}`,
    lastResult,
    defaultValue: values as Record<string, unknown>,
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
    // Withdrawing and saving a draft take the form as it is: only submitting checks every field.
    onValidate: ({ formData }) =>
      UNCHECKED_INTENTS.has(String(formData.get("intent")))
        ? parseWithZod(formData, { schema: reportSchema.or(z.any()) as unknown as typeof reportSchema })
        : parseWithZod(formData, { schema: reportSchema }),
  });
}

type AutosaveReply = { autosaved: true; reportId: number; savedAt: string } | { autosaved: false; error: string } | { result: unknown };

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

/** Keeps the form on this device and offers a kept one back, once, when the page opens. */
export function useOfflineDraft(reportId: number | null, saved: Record<string, string>) {
  const key = offlineDraftKey(reportId);
  const [opened] = useState(saved);
  const [offer, setOffer] = useState<OfflineDraft | null>(null);
  useEffect(() => {
    const raw = localStorage.getItem(key);
    if (!raw) return;
    try {
      const kept = JSON.parse(raw) as OfflineDraft;
      if (differsFromSaved(kept, opened)) setOffer(kept);
    } catch {
      localStorage.removeItem(key);
    }
  }, [key, opened]);
  return {
    offer,
    keep: (values: Record<string, string>) => localStorage.setItem(key, JSON.stringify({ at: new Date().toISOString(), values } satisfies OfflineDraft)),
    discard: () => {
      localStorage.removeItem(key);
      setOffer(null);
    },
    dismiss: () => setOffer(null),
  };
}

/** The form's current values by name. */
export function formEntries(form: HTMLFormElement): Record<string, string> {
  return Object.fromEntries([...new FormData(form)].map(([k, v]) => [k, String(v)]));
}

/** Puts values into the form's fields as if typed (radios and checkboxes by value; hidden fields kept). */
export function fillForm(form: HTMLFormElement, values: Record<string, string>) {
  for (const [name, value] of Object.entries(values)) {
    for (const node of form.querySelectorAll<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>(`[name="${name}"]`)) {
      if (node instanceof HTMLInputElement && (node.type === "radio" || node.type === "checkbox")) node.checked = node.value === value;
      else if (!(node instanceof HTMLInputElement && node.type === "hidden")) node.value = value;
      node.dispatchEvent(new Event("input", { bubbles: true }));
      node.dispatchEvent(new Event("change", { bubbles: true }));
    }
  }
}
