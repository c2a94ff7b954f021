// The query of the day calculator (/day) and of the exposure panels: what a URL asks, checked, with a
// message for each field that cannot be used. Pure: the catalogue's choices come in as arguments.
import { VIBRATION_BASES, type VibrationBasis } from "./in-use";

export const MAX_DAY_ROWS = 8;
export const JOBS_PER_DAY = { min: 1, max: 200, default: 6 } as const;
export const MINUTES_PER_JOB = { min: 0.1, max: 480 } as const;

export interface DayRowInput {
  tool: string;
  job: string;
  /** Jobs per day, as typed. */
  n: string;
  /** Minutes per job, as typed; blank: the median from reports. */
  min: string;
}

export interface DayRow {
  tool: string;
  job: string;
  jobsPerDay: number;
  minutesPerJob: number | null;
}

export interface DayQuery {
  rows: DayRowInput[];
  basis: VibrationBasis;
  /** Field errors by name: "tool-0", "n-2", "vib", "rows". */
  errors: Record<string, string>;
  /** The rows that can be worked out, in order, with their input index. */
  valid: (DayRow & { index: number })[];
}

export interface DayChoices {
  tools: ReadonlyMap<string, { category: string }>;
  jobs: ReadonlyMap<string, { category: string; name: string }>;
}

const WHOLE = /^[0-9]{1,4}$/;
const DECIMAL = /^[0-9]{1,4}(\.[0-9]{1,2})?$/;

/** "vib=declared|in-use"; absent is declared; anything else is an error with a message. */
export function readBasis(params: URLSearchParams): { basis: VibrationBasis; error: string | null } {
  const raw = params.get("vib");
  if (raw === null || raw === "") return { basis: "declared", error: null };
  if ((VIBRATION_BASES as readonly string[]).includes(raw)) return { basis: raw as VibrationBasis, error: null };
  return { basis: "declared", error: "Vibration figures: choose declared or in-use" };
}

/** "perday=6": jobs per day for the panels; absent is the default; anything else is an error. */
export function readJobsPerDay(params: URLSearchParams): { perDay: number; error: string | null } {
  const raw = params.get("perday");
  if (raw === null || raw === "") return { perDay: JOBS_PER_DAY.default, error: null };
  const n = WHOLE.test(raw.trim()) ? Number(raw.trim()) : Number.NaN;
  if (n >= JOBS_PER_DAY.min && n <= JOBS_PER_DAY.max) return { perDay: n, error: null };
  return { perDay: JOBS_PER_DAY.default, error: jobsMessage };
}

const jobsMessage = `Jobs per day: a whole number from ${JOBS_PER_DAY.min} to ${JOBS_PER_DAY.max}`;

/**
 * Rows from repeated tool, job, n and min parameters, matched by position. A row left wholly blank is
 * skipped; any other row must name a known tool, a job of the tool's kind and a number of jobs; minutes
 * per job are optional.
 */
export function readDayQuery(params: URLSearchParams, choices: DayChoices): DayQuery {
  const errors: Record<string, string> = {};
  const { basis, error } = readBasis(params);
  if (error) errors.vib = error;
  const [tools, jobs, ns, mins] = (["tool", "job", "n", "min"] as const).map((k) => params.getAll(k));
  const count = Math.max(tools!.length, jobs!.length, ns!.length, mins!.length);
  const rows: DayRowInput[] = [];
  for (let i = 0; i < count; i++) {
    const row = { tool: tools![i] ?? "", job: jobs![i] ?? "", n: (ns![i] ?? "").trim(), min: (mins![i] ?? "").trim() };
    if (row.tool || row.job || row.n || row.min) rows.push(row);
  }
  if (rows.length > MAX_DAY_ROWS) errors.rows = `At most ${MAX_DAY_ROWS} rows; the rest were left out`;
  const kept = rows.slice(0, MAX_DAY_ROWS);
  const valid: DayQuery["valid"] = [];
  kept.forEach((row, i) => {
    const tool = choices.tools.get(row.tool);
    const job = choices.jobs.get(row.job);
    if (!tool) errors[`tool-${i}`] = "Pick a tool";
    if (!job) errors[`job-${i}`] = "Pick a job";
    else if (tool && job.category !== tool.category) errors[`job-${i}`] = `${job.name} is not a job for this tool`;
    const n = WHOLE.test(row.n) ? Number(row.n) : Number.NaN;
    if (!(n >= JOBS_PER_DAY.min && n <= JOBS_PER_DAY.max)) errors[`n-${i}`] = jobsMessage;
    let minutes: number | null = null;
    if (row.min !== "") {
      minutes = DECIMAL.test(row.min) ? Number(row.min) : Number.NaN;
      if (!(minutes >= MINUTES_PER_JOB.min && minutes <= MINUTES_PER_JOB.max))
        errors[`min-${i}`] =
          `Minutes per job: from ${MINUTES_PER_JOB.min} to ${MINUTES_PER_JOB.max}, or blank for the median`;
    }
    if (!errors[`tool-${i}`] && !errors[`job-${i}`] && !errors[`n-${i}`] && !errors[`min-${i}`])
      valid.push({ index: i, tool: row.tool, job: row.job, jobsPerDay: n, minutesPerJob: minutes });
  });
  return { rows: kept, basis, errors, valid };
}
