// A local mail catcher: accepts SMTP on loopback and keeps every message as an .eml file.
import { randomBytes } from "node:crypto";
import { createWriteStream, mkdirSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";

export async function startMailCatcher({ port, dir }: { port: number; dir: string }) {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Bayproof local mail catcher",
    logger: false,
    onData(stream, _session, callback) {
      const file = path.join(dir, `${Date.now()}-${randomBytes(6).toString("hex")}.eml`);
      const out = createWriteStream(file);
      stream.pipe(out);
      out.on("finish", () => callback());
      out.on("error", (error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return {
    url: `smtp://127.0.0.1:${port}`,
    dir,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
