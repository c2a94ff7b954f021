// The header in which server.ts passes the client's socket address to the app. server.ts
// overwrites whatever a client sent under this name, so the app can trust it.
export const CLIENT_ADDRESS_HEADER = "x-bayproof-client-address";
