// Typed text, everywhere a person types: NUL and the other C0 control characters (tab, line feed
// and carriage return excepted) never belong in it, and PostgreSQL refuses NUL in text outright.
import { z } from "zod";

// eslint-disable-next-line no-control-regex -- the control characters are exactly what this refuses
const CONTROL_CHARACTERS = /[\u0000-\u0008\u000B\u000C\u000E-\u001F]/;

export const CONTROL_CHARACTER_MESSAGE = "Leave out invisible control characters (such as NUL); type plain text";

export function hasControlCharacters(text: string): boolean {
  return CONTROL_CHARACTERS.test(text);
}

/** A text field of any form: refuses control characters with a field message. */
export const plainText = (error?: string) =>
  z
    .string(error === undefined ? undefined : { error })
    .refine((s) => !hasControlCharacters(s), CONTROL_CHARACTER_MESSAGE);
