// The header in which server.js passes the client's socket address to the app. server.js
// overwrites whatever a client sent under this name, so the app can trust it.
export const CLIENT_ADDRESS_HEADER = "x-bayproof-client-address";
