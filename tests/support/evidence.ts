// The browser's side of an evidence upload, over plain HTTP: presign, PUT to storage, complete.
import type { Browserish } from "./http";

const cookie = (client: Browserish) => [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ");

export function presign(client: Browserish, reportId: number, body: unknown) {
  return fetch(new URL(`/api/reports/${reportId}/evidence`, client.origin), {
    method: "POST",
    headers: { cookie: cookie(client), origin: client.origin, "content-type": "application/json" },
    body: JSON.stringify(body),
  });
}

export function complete(client: Browserish, evidenceId: number) {
  return fetch(new URL(`/api/evidence/${evidenceId}/complete`, client.origin), {
    method: "POST",
    headers: { cookie: cookie(client), origin: client.origin },
  });
}

export function publish(client: Browserish, evidenceId: number, body: unknown) {
  return fetch(new URL(`/api/evidence/${evidenceId}/publish`, client.origin), {
    method: "POST",
    headers: { cookie: cookie(client), origin: client.origin, "content-type": "application/json" },
    body: JSON.stringify(body),
  });
}

export async function upload(client: Browserish, reportId: number, bytes: Buffer, claimedType: string) {
  const signed = await presign(client, reportId, { type: claimedType, size: bytes.length });
  if (signed.status !== 200) throw new Error(`presign answered ${signed.status}`);
  const { url, key, evidenceId, headers } = await signed.json();
  const put = await fetch(url, { method: "PUT", headers, body: new Uint8Array(bytes) });
  if (put.status !== 200) throw new Error(`storage answered ${put.status}`);
  return {
    key: key as string,
    url: url as string,
    evidenceId: evidenceId as number,
    check: await complete(client, evidenceId),
  };
}

export async function newDraft(client: Browserish, toolModel = "brackwater-bh-150", jobType = "ball-joint-separation") {
  const res = await client.post("/reports/new", { intent: "save-draft", pu: "psi", lu: "in", toolModel, jobType });
  return Number(res.headers.get("location")!.match(/\/reports\/(\d+)\/edit/)![1]);
}
