// A local mail catcher: accepts SMTP on loopback and keeps every message as an .eml file.
import { randomBytes } from "node:crypto";
import { createWriteStream, existsSync, mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";

export async function startMailCatcher({ port, dir }: { port: number; dir: string }) {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Bayproof local mail catcher",
    logger: false,
    onData(stream, session, callback) {
      // Tests drop a `.reject-next-<address>` file here to make the next delivery to that address
      // fail once (451), as a relay under load would; the sender must retry. A `.refuse-<address>`
      // file makes every delivery to that address fail while it is there, as a relay that is down
      // would, without stopping the catcher other tests use.
      const flag = (name: string) =>
        session.envelope.rcptTo
          .map((r) => path.join(dir, `.${name}-${r.address.toLowerCase()}`))
          .find((f) => existsSync(f));
      const rejectFlag = flag("reject-next");
      const refuseFlag = flag("refuse");
      if (rejectFlag || refuseFlag) {
        if (rejectFlag) rmSync(rejectFlag, { force: true });
        stream.resume();
        stream.on("end", () => callback(Object.assign(new Error("Try again later"), { responseCode: 451 })));
        return;
      }
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
