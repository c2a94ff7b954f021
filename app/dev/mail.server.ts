// Reads the local mail catcher's .eml files (fakes/mail.ts). Exists only where the catcher runs.
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { simpleParser } from "mailparser";
import { config } from "~/config.server";
import { refuse } from "~/utils/http";

const ID = /^[0-9]{13}-[a-z0-9]{6,12}$/;

function catcherDir(): string {
  if (!config.mail.catcherDir) refuse("Not found", 404);
  return config.mail.catcherDir;
}

export async function listMessages(limit = 50) {
  const dir = catcherDir();
  const files = (await readdir(dir).catch(() => [] as string[]))
    .filter((f) => f.endsWith(".eml"))
    .sort()
    .reverse()
    .slice(0, limit);
  return Promise.all(
    files.map(async (file) => {
      const mail = await simpleParser(await readFile(path.join(dir, file)));
      return {
        id: file.replace(/\.eml$/, ""),
        to: mail.to && !Array.isArray(mail.to) ? mail.to.text : "",
        subject: mail.subject ?? "",
        date: mail.date?.toISOString() ?? null,
      };
    }),
  );
}

export async function getMessage(id: string) {
  const dir = catcherDir();
  if (!ID.test(id)) refuse("No such message", 404);
  const raw = await readFile(path.join(dir, `${id}.eml`)).catch(() => null);
  if (!raw) refuse("No such message", 404);
  const mail = await simpleParser(raw);
  return {
    id,
    to: mail.to && !Array.isArray(mail.to) ? mail.to.text : "",
    from: mail.from?.text ?? "",
    subject: mail.subject ?? "",
    date: mail.date?.toISOString() ?? null,
    text: mail.text ?? "",
  };
}
