import { createContext, useContext } from "react";
import { createContext as createRouterContext } from "react-router";

/** The per-request CSP nonce, set by the root middleware and read by entry.server. */
export const nonceContext = createRouterContext<string>("");

const NonceReactContext = createContext("");
export const NonceProvider = NonceReactContext.Provider;
/** Empty in the browser: browsers hide nonces from scripts, and only the server render needs it. */
export const useNonce = () => useContext(NonceReactContext);
