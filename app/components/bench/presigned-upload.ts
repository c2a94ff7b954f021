// A file sent straight to storage: ask our endpoint for a presigned PUT (it checks who is asking and
// what the file may be), then PUT the file there. Resolves to the upload's key, which the form
// submits; throws with a message to show beside the field.
export async function presignedUpload(endpoint: string, ask: Record<string, unknown>, file: File): Promise<string> {
  const res = await fetch(endpoint, {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify(ask),
  }).catch(() => null);
  const body = (res ? await res.json().catch(() => ({})) : {}) as {
    key?: string;
    url?: string;
    headers?: Record<string, string>;
    error?: string;
  };
  if (!res?.ok || !body.url || !body.key) throw new Error(body.error ?? "The upload could not start; try again.");
  const put = await fetch(body.url, { method: "PUT", headers: body.headers, body: file }).catch(() => null);
  if (!put?.ok) throw new Error("The file store did not take the file; try again in a moment.");
  return body.key;
}
