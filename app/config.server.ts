// Configuration from the environment, with local defaults (README, "Configuration"). Read once, when
// the server (or the worker) starts; everything else takes its settings from here. server.js reads
// the same object through the build (app/entry.server.tsx).
import { DEFAULT_DATABASE_URL } from "../db/database";

const env = process.env;

const port = env.PORT ?? "3000";

/** A whole number from the environment between min and max, or its default; anything else stops the start. */
function wholeNumber(name: string, fallback: number, min: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw.trim() === "") return fallback;
  const value = /^\d{1,10}$/.test(raw.trim()) ? Number(raw.trim()) : NaN;
  if (!(value >= min && value <= max))
    throw new Error(`${name} must be a whole number from ${min} to ${max} (it is "${raw}"); unset, it is ${fallback}.`);
  return value;
}

export const config = {
  /** Where server.js listens. */
  listen: { host: env.HOST ?? "127.0.0.1", port: Number(port) },
  /** React Router's mode for the request handler ("production" unless told). */
  mode: env.NODE_ENV,
  /** The origin users reach the app at; https turns on Secure and __Host- cookies. */
  appOrigin: (env.APP_ORIGIN ?? `http://127.0.0.1:${port}`).replace(/\/$/, ""),
  /** Trust the first X-Forwarded-For hop (only behind a load balancer that sets it). */
  trustProxy: env.BAYPROOF_TRUST_PROXY === "1",
  databaseUrl: env.DATABASE_URL ?? DEFAULT_DATABASE_URL,
  /**
   * A read replica for the feed, stats and catalogue reads (writes and sessions stay on the primary);
   * unset, those reads go to the primary too.
   */
  databaseReadUrl: env.DATABASE_READ_URL || null,
  feed: {
    /** Requests a minute per API key on the open feed (anonymous clients have a fixed 60). */
    keyLimit: wholeNumber("BAYPROOF_FEED_KEY_LIMIT", 600, 1, 1_000_000_000),
  },
  /** The in-process cache of anonymous public pages, in MB (0 turns it off; docs/decisions/012). */
  pageCacheMb: Number(env.BAYPROOF_PAGE_CACHE_MB ?? "64"),
  oidc: {
    id: env.OIDC_PROVIDER_ID ?? "local",
    name: env.OIDC_PROVIDER_NAME ?? "Bayproof demo ID (local)",
    issuer: env.OIDC_ISSUER ?? "http://127.0.0.1:54330",
    authorizationUrl: env.OIDC_AUTHORIZATION_URL ?? "http://127.0.0.1:54330/authorize",
    tokenUrl: env.OIDC_TOKEN_URL ?? "http://127.0.0.1:54330/token",
    clientId: env.OIDC_CLIENT_ID ?? "bayproof-local",
    clientSecret: env.OIDC_CLIENT_SECRET ?? "local-secret",
  },
  mail: {
    smtpUrl: env.SMTP_URL ?? "smtp://127.0.0.1:54325",
    from: env.MAIL_FROM ?? "Bayproof <no-reply@bayproof.test>",
    /** Set only where the local mail catcher runs; turns on /dev/mail. */
    catcherDir: env.BAYPROOF_MAIL_CATCHER_DIR || null,
  },
  search: {
    url: env.SEARCH_URL ?? "http://127.0.0.1:54350",
    apiKey: env.SEARCH_API_KEY,
  },
  storage: {
    endpoint: env.S3_ENDPOINT ?? "http://127.0.0.1:54340",
    bucket: env.S3_BUCKET ?? "bayproof-evidence",
    region: env.S3_REGION ?? "us-east-1",
    forcePathStyle: env.S3_FORCE_PATH_STYLE !== "0",
    accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER",
    secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
  },
};

export const isHttps = config.appOrigin.startsWith("https://");
