// The stuck-work page's table (/admin/jobs): one row a job, with its last error and when it gave up or runs next.
import type { ReactNode } from "react";
import type { StuckJob } from "~/jobs/stuck.server";
import { DataTable } from "~/components/ui";

export function JobTable({
  label,
  jobs,
  when,
  action,
}: {
  label: string;
  jobs: StuckJob[];
  when: string;
  action?: (id: string) => ReactNode;
}) {
  return (
    <DataTable
      label={label}
      minWidth="48rem"
      bodyClassName="align-top"
      head={
        <tr>
          <th className="px-3 py-2">Queue</th>
          <th className="px-3 py-2">What it was for</th>
          <th className="px-3 py-2">Last error</th>
          <th className="px-3 py-2">Tries</th>
          <th className="px-3 py-2">{when}</th>
          {action && (
            <th className="px-3 py-2">
              <span className="sr-only">Action</span>
            </th>
          )}
        </tr>
      }
    >
      {jobs.map((j) => (
        <tr key={j.id}>
          <td className="px-3 py-2 font-mono text-xs">{j.queue}</td>
          <td className="px-3 py-2">
            {j.what}
            <span className="block text-xs text-stone-500">queued {at(j.createdAt)}</span>
          </td>
          <td className="px-3 py-2 text-red-900">{j.lastError ?? "—"}</td>
          <td className="px-3 py-2">{`${j.attempts} of ${j.allowedAttempts}`}</td>
          <td className="px-3 py-2">{at(j.at)}</td>
          {action && <td className="px-3 py-2">{j.canSendAgain ? action(j.id) : null}</td>}
        </tr>
      ))}
    </DataTable>
  );
}

/** A moment to the minute, in UTC like the job table. */
const at = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
