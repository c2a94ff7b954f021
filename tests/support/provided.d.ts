// Values the global setup hands to tests through inject().
declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    baseUrl: string;
    mailDir: string;
    oidcUrl: string;
    s3: { endpoint: string; bucket: string };
    searchUrl: string;
    serverLog: string;
    /** The environment the app server was started with (fakes, database, origin). */
    appEnv: Record<string, string>;
  }
}
export {};
