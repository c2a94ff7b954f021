// The slug as a form field. Apart from slug.ts (and not in the domain barrel) because it brings zod:
// pages that only format or link with the vocabulary should not ship a schema library.
import { z } from "zod";
import { SLUG_MAX_LENGTH, SLUG_RE } from "./slug";

/** A slug field with the message its form shows when the value is not one. */
export const slugField = (message = "Not a slug") =>
  z.string({ error: message }).max(SLUG_MAX_LENGTH, message).regex(SLUG_RE, message);
