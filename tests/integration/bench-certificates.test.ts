// A calibration's certificate: the rig's owner alone gets an upload URL, the file goes straight to
// the store, and saving the calibration copies it out and checks its bytes (PDF, PNG or JPEG; an
// upload of somebody else's, or any other key, is refused on the field). The owner and moderators
// fetch it; anyone else, signed in or not, gets 404, as for a calibration without one.
import { HeadObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { testDb } from "../support/db";
import { fakeExecutable, tinyPng } from "../support/files";
import { Browserish, signedInAs } from "../support/http";

const db = testDb();
const { endpoint, bucket } = inject("s3");
const s3 = new S3Client({
  endpoint,
  region: "us-east-1",
  forcePathStyle: true,
  credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
});
const exists = (key: string) =>
  s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key })).then(
    () => true,
    () => false,
  );

let owner: Browserish;
let moderator: Browserish;
let stranger: Browserish;
let visitor: Browserish;
let rigId: number;
let strangerRigId: number;
const rigs: number[] = [];

/** A one-page PDF, small but real enough for its magic number. */
const tinyPdf = () =>
  Buffer.from(
    "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\n" +
      "trailer<</Root 1 0 R>>\n%%EOF\n",
    "latin1",
  );

const straightRows = "0,0.2\n1000,1000.9\n2000,2000.6\n3000,3001.3\n4000,4000.8";

async function register(client: Browserish, name: string) {
  const model = await db
    .selectFrom("tool_models as m")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select("m.id")
    .where("c.slug", "=", "air-hammer")
    .orderBy("m.id")
    .executeTakeFirstOrThrow();
  const res = await client.post("/bench/rigs/new", {
    name,
    kind: "percussive_force",
    capacity: "5000",
    sampleRateHz: "20000",
    fixture: "A 40 kg steel anvil on a load cell, bolted to the slab",
    checkToolModelId: String(model.id),
    checkIntervalMonths: "12",
  });
  expect(res.status).toBe(302);
  const id = Number(/^\/bench\/rigs\/(\d+)$/.exec(res.headers.get("location") ?? "")?.[1]);
  expect(id).toBeGreaterThan(0);
  rigs.push(id);
  return id;
}

const cookie = (client: Browserish) => [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ");

function askUpload(client: Browserish, body: unknown) {
  return fetch(new URL("/api/bench/certificates", client.origin), {
    method: "POST",
    headers: { cookie: cookie(client), origin: client.origin, "content-type": "application/json" },
    body: JSON.stringify(body),
  });
}

/** The browser's side: an upload URL for the claimed type, then the PUT; the key the form sends. */
async function upload(client: Browserish, rig: number, bytes: Buffer, type: string) {
  const res = await askUpload(client, { rigId: rig, type, size: bytes.length });
  expect(res.status).toBe(200);
  const { key, url, headers } = (await res.json()) as { key: string; url: string; headers: Record<string, string> };
  const put = await fetch(url, { method: "PUT", headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  return key;
}

const calibrations = (rig: number) =>
  db.selectFrom("rig_calibrations").select(["id", "certificate_key"]).where("rig_id", "=", rig).orderBy("id").execute();

const save = (client: Browserish, rig: number, certificate: string, calibratedOn = "2026-11-01") =>
  client.post(`/bench/rigs/${rig}/calibrations/new`, {
    points: straightRows,
    calibratedOn,
    certificate,
    intent: "save",
  });

beforeAll(async () => {
  owner = await signedInAs(db, "reporter@demo.bayproof.test");
  moderator = await signedInAs(db, "moderator@demo.bayproof.test");
  stranger = await signedInAs(db, "torque-omar@demo.bayproof.test");
  visitor = new Browserish();
  rigId = await register(owner, "Test rig with a certificate");
  strangerRigId = await register(stranger, "Someone else's test rig");
});
afterAll(async () => {
  if (rigs.length) await db.deleteFrom("rigs").where("id", "in", rigs).execute();
  await db.destroy();
});

describe("the upload URL", () => {
  it("is issued to the rig's owner only", async () => {
    const body = { rigId, type: "application/pdf", size: 2048 };
    const res = await askUpload(owner, body);
    expect(res.status).toBe(200);
    const given = (await res.json()) as { key: string; url: string };
    expect(given.key).toMatch(/^uploads\/certificates\/\d+\/[A-Za-z0-9_-]{16,40}$/);
    expect(given.url).toContain(given.key);
    expect((await askUpload(stranger, body)).status).toBe(403);
    expect((await askUpload(moderator, body)).status).toBe(403);
    expect((await askUpload(visitor, body)).status).toBe(401);
    expect((await askUpload(owner, { ...body, rigId: 2_147_483_000 })).status).toBe(404);
  });

  it("is refused for another type of file or one over 10 MB, with the reason", async () => {
    let res = await askUpload(owner, { rigId, type: "text/html", size: 2048 });
    expect(res.status).toBe(415);
    expect(((await res.json()) as { error: string }).error).toContain("PDF, PNG or JPEG");
    res = await askUpload(owner, { rigId, type: "application/pdf", size: 10 * 1024 * 1024 + 1 });
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: string }).error).toContain("at most 10 MB");
  });
});

describe("the calibration form", () => {
  it("says the certificate is optional and needs JavaScript", async () => {
    const html = await (await owner.get(`/bench/rigs/${rigId}/calibrations/new`)).text();
    expect(html).toContain("Calibration certificate (optional)");
    expect(html).toContain("Sending it needs JavaScript; without it the calibration is saved without a certificate");
    expect(html).toMatch(/<input[^>]*type="hidden"[^>]*name="certificate"/);
    expect(html).toMatch(
      /<input[^>]*aria-describedby="certificate-description"[^>]*id="certificate"|<input[^>]*id="certificate"[^>]*aria-describedby="certificate-description"/,
    );
  });

  it("refuses an upload of somebody else's, or any other key, on the field", async () => {
    const theirs = await upload(stranger, strangerRigId, tinyPdf(), "application/pdf");
    for (const key of [theirs, "certificates/1/abcdefghijklmnopqrstuvwx", "uploads/bench/1/abcdefghijklmnopqrstuvwx"]) {
      const res = await save(owner, rigId, key);
      expect(res.status).toBe(400);
      const html = await res.text();
      expect(html).toContain("This certificate is not one of your uploads; choose the file again");
      expect(html).toContain('href="#certificate"'); // the error summary links to the field
      expect(html).toContain('id="certificate-error"');
      expect(html).toContain("4000,4000.8"); // what was typed is kept
    }
    expect(await calibrations(rigId)).toEqual([]);
    expect(await exists(theirs)).toBe(true); // their upload is left alone
  });

  it("refuses a file whose bytes are not a PDF, PNG or JPEG, whatever it was sent as", async () => {
    const key = await upload(owner, rigId, fakeExecutable(), "application/pdf");
    const res = await save(owner, rigId, key);
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain("This file is not a PDF, PNG or JPEG, whatever its name says");
    expect(html).toContain('id="certificate-error"');
    expect(await calibrations(rigId)).toEqual([]);
    expect(await exists(key)).toBe(false); // the refused upload is removed
    const again = await save(owner, rigId, key);
    expect(again.status).toBe(400);
    expect(await again.text()).toContain("This certificate has not arrived in storage; choose the file again");
  });

  it("saves a calibration without a certificate, as a form without JavaScript sends it", async () => {
    const res = await owner.post(`/bench/rigs/${rigId}/calibrations/new`, {
      points: straightRows,
      calibratedOn: "2026-10-01",
      intent: "save",
    });
    expect(res.status).toBe(302);
    const rows = await calibrations(rigId);
    expect(rows).toHaveLength(1);
    expect(rows[0]!.certificate_key).toBeNull();
    expect((await owner.get(`/bench/rigs/${rigId}/calibrations/${rows[0]!.id}/certificate`)).status).toBe(404);
  });
});

describe("a stored certificate", () => {
  let calibrationId: number;
  let path: string;
  const pdf = tinyPdf();

  beforeAll(async () => {
    const key = await upload(owner, rigId, pdf, "application/pdf");
    expect((await save(owner, rigId, key, "2026-11-02")).status).toBe(302);
    const row = (await calibrations(rigId)).at(-1)!;
    calibrationId = row.id;
    expect(row.certificate_key).toMatch(new RegExp(`^certificates/${calibrationId}/[A-Za-z0-9_-]+$`));
    expect(await exists(row.certificate_key!)).toBe(true);
    expect(await exists(key)).toBe(false); // the upload is not kept once copied
    path = `/bench/rigs/${rigId}/calibrations/${calibrationId}/certificate`;
  });

  for (const who of ["owner", "moderator"] as const) {
    it(`is fetched by the ${who} as the file it is`, async () => {
      const client = who === "owner" ? owner : moderator;
      const res = await client.get(path);
      expect(res.status).toBe(302);
      expect(res.headers.get("cache-control")).toContain("no-store");
      const file = await fetch(res.headers.get("location")!);
      expect(file.status).toBe(200);
      expect(file.headers.get("content-type")).toBe("application/pdf");
      expect(Buffer.from(await file.arrayBuffer()).equals(pdf)).toBe(true);
      const page = await (await client.get(`/bench/rigs/${rigId}`)).text();
      expect(page).toContain("Calibration certificates");
      expect(page).toContain(`href="${path}"`);
    });
  }

  it("answers 404 to a visitor and to another signed-in user, and keeps the link off their page", async () => {
    for (const client of [visitor, stranger]) {
      const res = await client.get(path);
      expect(res.status).toBe(404);
      expect(res.headers.get("location")).toBeNull();
      const page = await (await client.get(`/bench/rigs/${rigId}`)).text();
      expect(page).not.toContain(path);
      expect(page).not.toContain("Calibration certificates");
      expect(page).not.toContain("certificates/"); // where it is stored stays on the server
    }
  });

  it("answers 404 for a calibration of another rig, or none", async () => {
    expect((await owner.get(`/bench/rigs/${strangerRigId}/calibrations/${calibrationId}/certificate`)).status).toBe(
      404,
    );
    expect((await owner.get(`/bench/rigs/${rigId}/calibrations/2147483000/certificate`)).status).toBe(404);
    expect((await owner.get(`/bench/rigs/${rigId}/calibrations/abc/certificate`)).status).toBe(404);
  });

  it("keeps the type the bytes show for a photo of the certificate", async () => {
    const key = await upload(owner, rigId, tinyPng(), "image/png");
    expect((await save(owner, rigId, key, "2026-11-03")).status).toBe(302);
    const row = (await calibrations(rigId)).at(-1)!;
    const res = await moderator.get(`/bench/rigs/${rigId}/calibrations/${row.id}/certificate`);
    expect(res.status).toBe(302);
    const file = await fetch(res.headers.get("location")!);
    expect(file.status).toBe(200);
    expect(file.headers.get("content-type")).toBe("image/png");
  });
});
