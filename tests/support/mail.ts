import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { simpleParser } from "mailparser";
import { inject } from "vitest";

/** The newest message the mail catcher holds for an address, waiting for it to arrive (a busy machine can take a while). */
export async function latestMailTo(address: string, after = 0, timeoutMs = 60_000) {
  const dir = inject("mailDir");
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const files = (await readdir(dir))
      .filter((f) => f.endsWith(".eml") && Number(f.split("-")[0]) >= after)
      .sort()
      .reverse();
    for (const f of files) {
      const mail = await simpleParser(await readFile(path.join(dir, f)));
      const to = mail.to && !Array.isArray(mail.to) ? mail.to.text : "";
      if (to.includes(address)) return mail;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${address}`);
}

export const linkIn = (text: string) => text.match(/https?:\/\/\S+\/sign-in\/link\?\S+/)?.[0] ?? null;
