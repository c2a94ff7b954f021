import { Form, Link } from "react-router";
import {
  COUPLER_LABELS,
  COUPLER_PROFILES,
  DEFAULT_COUPLER_PROFILE,
  formatFlow,
  formatPressure,
  formatPrice,
} from "~/domain";
import { prob } from "./intervals";

export interface WhichToolRow {
  slug: string;
  label: string;
  price: number | null;
  weightKg: number;
  inletKpa: number;
  /** The air it draws while running: the catalogue's figure, or its average times a stated factor. */
  running: { lps: number; source: "maker_sheet" | "measured" | "estimated"; factor: number | null };
  predicted: { estimate: number; lower: number; upper: number; extrapolating: boolean } | null;
  reason: string | null;
  needs: string[];
}

/** The shopper's supply in, per tool: what reaches it, the fitted chance there, what else it needs. */
export function WhichToolPanel({
  jobSlug,
  percussive,
  values,
  note,
  rows,
  pu,
}: {
  jobSlug: string;
  percussive: boolean;
  values: Record<string, string>;
  note: string | null;
  rows: WhichToolRow[] | null;
  pu: "psi" | "bar" | "kPa";
}) {
  const input = "mt-1 block w-full rounded border border-stone-300 px-3 py-2";
  return (
    <section aria-labelledby="which-heading" className="space-y-3 rounded-lg border border-bay-600 bg-white p-4">
      <h2 id="which-heading" className="text-lg font-semibold">
        Which tool, on your air?
      </h2>
      <Form
        method="get"
        action={`/jobs/${jobSlug}`}
        className="grid grid-cols-2 gap-3 sm:grid-cols-6"
        preventScrollReset
      >
        <label className="text-sm">
          <span className="font-semibold">Regulator, psi</span>
          <input name="reg" defaultValue={values.reg ?? ""} placeholder="100" inputMode="decimal" className={input} />
        </label>
        <label className="text-sm">
          <span className="font-semibold">Hose ID, in</span>
          <input name="hid" defaultValue={values.hid ?? ""} placeholder="3/8" className={input} />
        </label>
        <label className="text-sm">
          <span className="font-semibold">Hose length, ft</span>
          <input name="hlen" defaultValue={values.hlen ?? ""} placeholder="50" inputMode="decimal" className={input} />
        </label>
        <label className="text-sm">
          <span className="font-semibold">Couplers</span>
          <input name="cc" defaultValue={values.cc ?? "2"} inputMode="numeric" className={input} />
        </label>
        <label className="text-sm">
          <span className="font-semibold">Coupler style</span>
          <select name="cp" defaultValue={values.cp ?? DEFAULT_COUPLER_PROFILE} className={input}>
            {COUPLER_PROFILES.map((code) => (
              <option key={code} value={code}>
                {COUPLER_LABELS[code]}
              </option>
            ))}
          </select>
        </label>
        {percussive ? (
          <label className="text-sm">
            <span className="font-semibold">Bits you own</span>
            <select name="bits" defaultValue={values.bits ?? ""} className={input}>
              <option value="">none yet</option>
              <option value="shank-0.401">0.401 in shank</option>
              <option value="shank-0.498">0.498 in shank</option>
            </select>
          </label>
        ) : (
          <span />
        )}
        <button
          type="submit"
          className="col-span-2 rounded bg-bay-700 px-4 py-2 font-semibold text-white sm:col-span-6 sm:justify-self-start"
        >
          Show tools at my air
        </button>
      </Form>
      {note && (
        <p role="alert" className="text-sm text-amber-800">
          {note}
        </p>
      )}
      {rows && (
        <div className="which-tool-stack sm:overflow-x-auto">
          <table className="w-full text-left text-sm sm:min-w-[40rem]">
            <thead className="bg-stone-100 text-xs uppercase text-stone-600">
              <tr>
                <th className="px-3 py-2">Tool</th>
                <th className="px-3 py-2">Reaches the tool</th>
                <th className="px-3 py-2">Chance it frees the job there</th>
                <th className="px-3 py-2">Price · weight</th>
                <th className="px-3 py-2">Would also need</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100 align-top">
              {rows.map((r) => (
                <tr key={r.slug}>
                  <td className="px-3 py-2">
                    <Link to={`/models/${r.slug}`} className="font-semibold text-bay-700 hover:underline">
                      {r.label}
                    </Link>
                  </td>
                  <td className="px-3 py-2">
                    {formatPressure(r.inletKpa, pu)}
                    <div className="text-xs text-stone-600">{runningNote(r.running)}</div>
                  </td>
                  <td className="px-3 py-2">
                    {r.predicted ? (
                      <>
                        {prob(r.predicted.estimate)}{" "}
                        <span className="text-stone-500">
                          ({prob(r.predicted.lower)}–{prob(r.predicted.upper)})
                        </span>
                        {r.predicted.extrapolating && (
                          <div className="text-xs text-amber-700">
                            outside the pressures reported for it — an extrapolation
                          </div>
                        )}
                      </>
                    ) : (
                      <span className="text-xs text-stone-500">{r.reason}</span>
                    )}
                  </td>
                  <td className="px-3 py-2">
                    {formatPrice(r.price)} · {r.weightKg} kg
                  </td>
                  <td className="px-3 py-2 text-xs">{r.needs.length ? r.needs.join("; ") : "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-1 text-xs text-stone-600">
            Pressure at the tool while it runs, from the air it draws hammering or impacting (the catalogue's figure
            where it has one, otherwise an estimate: its rated average times the factor shown) through your regulator,
            couplers and hose, each solved at its own pressure (estimate); chance from the job's pooled logistic fit on
            inlet pressure (one slope for every tool on the job), with 95 % bands. Ordered by the lower end of that
            band. Tools without enough reports across pressures say so.
          </p>
        </div>
      )}
    </section>
  );
}

const RUNNING_FROM = { maker_sheet: "maker's sheet", measured: "measured", estimated: "estimate" } as const;

/** "draws 10.0 SCFM running (estimate: 2.5× rated)" */
function runningNote(r: WhichToolRow["running"]) {
  const from =
    r.source === "estimated" && r.factor != null ? `estimate: ${r.factor.toFixed(1)}× rated` : RUNNING_FROM[r.source];
  return `draws ${formatFlow(r.lps)} running (${from})`;
}
