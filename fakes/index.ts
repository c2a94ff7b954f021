// Starts every local fake on loopback and returns the environment that points the app at them.
import path from "node:path";
import { demoSubject, people } from "../seeds/people";
import { startMailCatcher } from "./mail";
import { startOidcProvider } from "./oidc";
import { startSearchService } from "./search";
import { FAKE_S3_CREDENTIALS, startObjectStore } from "./storage";

const wellKnown = (email: string) => (/^(reporter|moderator|moderator2|admin)@/.test(email) ? 1 : 0);

export interface FakePorts {
  oidc: number;
  smtp: number;
  s3: number;
  search: number;
}

const BUCKET = "bayproof-evidence";

/** `appOrigins`: where the app is served, for the object store's CORS rules. */
export async function startFakes({
  ports,
  dataDir,
  appOrigins,
}: {
  ports: FakePorts;
  dataDir: string;
  appOrigins: string[];
}) {
  const searchService = await startSearchService({ port: ports.search });
  const store = await startObjectStore({
    port: ports.s3,
    dir: path.join(dataDir, "objects"),
    bucket: BUCKET,
    origins: appOrigins,
  });
  const mailDir = path.join(dataDir, "mail");
  const mail = await startMailCatcher({ port: ports.smtp, dir: mailDir });
  const oidc = await startOidcProvider({
    port: ports.oidc,
    accounts: [...people]
      .sort((a, b) => wellKnown(b.email) - wellKnown(a.email))
      .map((p) => ({
        subject: demoSubject(p.handle),
        email: p.email,
        label: `${p.handle}${p.roles.length ? ` (${p.roles.join(", ")})` : ""}`,
      })),
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
      SEARCH_URL: searchService.url,
      S3_ENDPOINT: store.url,
      S3_BUCKET: BUCKET,
      S3_REGION: "us-east-1",
      S3_ACCESS_KEY_ID: FAKE_S3_CREDENTIALS.accessKeyId,
      S3_SECRET_ACCESS_KEY: FAKE_S3_CREDENTIALS.secretAccessKey,
    },
    async stop() {
      await Promise.all([mail.stop(), oidc.stop(), store.stop(), searchService.stop()]);
    },
  };
}
