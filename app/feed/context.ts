import { createContext } from "react-router";
import type { Caller } from "./access.server";

/** The admitted caller of a feed request, set by the /api/v1 middleware. */
export const callerContext = createContext<Caller | null>(null);
