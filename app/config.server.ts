// Configuration from the environment, with local defaults (README, "Configuration").
const env = process.env;

const port = env.PORT ?? "3000";

export const config = {
  /** The origin users reach the app at; https turns on Secure and __Host- cookies. */
  appOrigin: (env.APP_ORIGIN ?? `http://127.0.0.1:${port}`).replace(/\/$/, ""),
  /** Trust the first X-Forwarded-For hop (only behind a load balancer that sets it). */
  trustProxy: env.BAYPROOF_TRUST_PROXY === "1",
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
};

export const isHttps = config.appOrigin.startsWith("https://");
