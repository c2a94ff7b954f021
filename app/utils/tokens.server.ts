import { createHash, randomBytes } from "node:crypto";

/** A random secret of 32 bytes (256 bits), URL-safe. */
export const randomToken = (bytes = 32) => randomBytes(bytes).toString("base64url");

/** What the database keeps instead of a secret. */
export const sha256Hex = (value: string) => createHash("sha256").update(value).digest("hex");
