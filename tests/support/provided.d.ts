// Values the global setups hand to tests through inject().
declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    baseUrl: string;
  }
}
export {};
