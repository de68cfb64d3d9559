// Text fields refuse control characters: a NUL or another C0 control (or DEL) in a name, label or note
// has no meaning to a reader, breaks e-mail and some databases, and used to stop background jobs.
// Single-line fields refuse them all; multi-line fields (notes) allow tab and line breaks.
import { z } from 'zod';

/** Any C0 control character or DEL. */
export const CONTROL_CHARS = /[\u0000-\u001F\u007F]/;
/** C0 controls and DEL except tab, line feed and carriage return. */
export const CONTROL_CHARS_MULTILINE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

export const CONTROL_MESSAGE = 'Remove the control characters (such as NUL, tab or a line break): use plain text on one line.';
export const CONTROL_MESSAGE_MULTILINE = 'Remove the control characters (such as NUL): use plain text; tabs and line breaks are fine.';

type StringParams = Parameters<typeof z.string>[0];

/** A single-line text field (names, labels, e-mail addresses, codes). */
export function text(params?: StringParams) {
  return z.string(params).refine((s) => !CONTROL_CHARS.test(s), { message: CONTROL_MESSAGE, abort: true });
}

/** A multi-line text field (notes): tab, line feed and carriage return allowed. */
export function multilineText(params?: StringParams) {
  return z.string(params).refine((s) => !CONTROL_CHARS_MULTILINE.test(s), { message: CONTROL_MESSAGE_MULTILINE, abort: true });
}

/** Removes control characters a field may not hold (for text that did not come through a schema). */
export function stripControlChars(s: string, { multiline = false } = {}): string {
  return s.replace(new RegExp((multiline ? CONTROL_CHARS_MULTILINE : CONTROL_CHARS).source, 'g'), multiline ? '' : ' ');
}
