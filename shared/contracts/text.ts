// What a person may type into a name or a note. Names show in mail subjects, calendar feeds and
// other members' screens, so a control character or a text-direction override in one could make it
// read as something else (the "Trojan Source" trick, CVE-2021-42574).
import './zod';
import * as z from 'zod/mini';

// Unicode's control characters (General_Category Cc: C0, DEL, C1) and its Bidi_Control characters
// (the Arabic letter mark, LRM/RLM, the bidi embeddings and overrides, the bidi isolates).
const nameControls = /[\u0000-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/;
// Notes span lines: tab, line feed and carriage return stay allowed there.
const noteControls = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/;

/**
 * Whether every UTF-16 surrogate in the text is paired. ES2024's String.prototype.isWellFormed is in
 * Node 20 and every browser Angular 21 supports; the project's TypeScript lib is ES2022, hence the cast.
 */
export function isWellFormed(text: string): boolean {
  return (text as unknown as { isWellFormed(): boolean }).isWellFormed();
}

/** Whether the text may be a name: well formed, with no control or text-direction character. */
export function isSafeName(text: string): boolean {
  return isWellFormed(text) && !nameControls.test(text);
}

/** Whether the text may be a note: as a name, but tabs and line breaks are fine. */
export function isSafeNote(text: string): boolean {
  return isWellFormed(text) && !noteControls.test(text);
}

const brokenMessage = (label: string) => `${label} contains a broken character (half of a surrogate pair)`;
const controlMessage = (label: string) => `${label} contains a control or text-direction character`;

/** The checks for a human-entered name, e.g. `z.string().check(z.trim(), ...safeName('Studio name'))`. */
export function safeName(label: string) {
  return [
    z.refine<string>(isWellFormed, { message: brokenMessage(label), abort: true }),
    z.refine<string>((text) => !nameControls.test(text), controlMessage(label)),
  ];
}

/** The checks for free text written by a person (notes): line breaks and tabs are allowed. */
export function safeNote(label: string) {
  return [
    z.refine<string>(isWellFormed, { message: brokenMessage(label), abort: true }),
    z.refine<string>((text) => !noteControls.test(text), controlMessage(label)),
  ];
}

/**
 * The same checks for a field of an object schema defined outside the contracts (markets, runway
 * steps), so the issue's path still names the field.
 */
export function safeTextAt<T extends object>(field: keyof T & string, label: string, kind: 'name' | 'note' = 'name') {
  const isSafe = kind === 'name' ? isSafeName : isSafeNote;
  return z.superRefine<T>((value, context) => {
    const text = (value as Record<string, unknown>)[field];
    if (typeof text !== 'string' || isSafe(text)) return;
    const message = isWellFormed(text) ? controlMessage(label) : brokenMessage(label);
    context.issues.push({ code: 'custom', message, input: text, path: [field] });
  });
}
