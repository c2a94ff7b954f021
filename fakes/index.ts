// Starts every local fake on loopback and returns the environment that points the app at them.
import path from "node:path";
import { demoSubject, people } from "../seeds/people";
import { startMailCatcher } from "./mail";
import { startOidcProvider } from "./oidc";

const wellKnown = (email: string) => (/^(reporter|moderator|moderator2|admin)@/.test(email) ? 1 : 0);

export interface FakePorts {
  oidc: number;
  smtp: number;
}

export async function startFakes({ ports, dataDir }: { ports: FakePorts; dataDir: string }) {
  const mailDir = path.join(dataDir, "mail");
  const mail = await startMailCatcher({ port: ports.smtp, dir: mailDir });
  const oidc = await startOidcProvider({
    port: ports.oidc,
    accounts: [...people].sort((a, b) => wellKnown(b.email) - wellKnown(a.email)).map((p) => ({ subject: demoSubject(p.handle), email: p.email, label: `${p.handle}${p.roles.length ? ` (${p.roles.join(", ")})` : ""}` })),
  });
  return {
    env: {
      SMTP_URL: mail.url,
      BAYPROOF_MAIL_CATCHER_DIR: mailDir,
      OIDC_PROVIDER_ID: "local",
      OIDC_ISSUER: oidc.url,
      OIDC_AUTHORIZATION_URL: `${oidc.url}/authorize`,
      OIDC_TOKEN_URL: `${oidc.url}/token`,
      OIDC_CLIENT_ID: "bayproof-local",
      OIDC_CLIENT_SECRET: "local-secret",
    },
    async stop() {
      await Promise.all([mail.stop(), oidc.stop()]);
    },
  };
}
