/**
 * What no text field of Resetwise holds: the C0 control characters except tab, line feed and carriage return
 * (a pasted CRLF line end), DEL, and the C1 controls. PostgreSQL refuses U+0000 in text and jsonb outright;
 * the others are refused with it, because no requirement set, part, ballot or brief needs them and they
 * hide text from the people who read it. Safe on both sides (forms check with it too).
 */
export const CONTROL_CHARACTER = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

const CONTROL_CHARACTERS = new RegExp(CONTROL_CHARACTER.source, 'g');

/** `a\u0000b` as readable text: each control character written as its \uXXXX escape. */
export function showControls(text: string): string {
  return text.replace(CONTROL_CHARACTERS, (c) => `\\u${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
}

/** The code point of the first control character in `text`, as "U+0000", or null when there is none. */
export function firstControl(text: string): string | null {
  const match = CONTROL_CHARACTER.exec(text);
  return match ? `U+${match[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}` : null;
}

/** The plain message for a field holding a control character. */
export function controlMessage(field: string, codePoint: string): string {
  return `${field} must not contain control characters (it holds ${codePoint}); tab and new lines are fine`;
}

export interface TextProblem {
  field: string;
  message: string;
}

/**
 * Every string and every object key in a parsed JSON value that holds a control character, with its dotted
 * path as zod names fields (`part.id`, `ranking.0`); a bad key is named by the key itself, escaped. Walks
 * with its own stack, so depth cannot overflow the call stack; stops after `max` problems.
 */
export function controlCharactersIn(value: unknown, max = 20): TextProblem[] {
  const problems: TextProblem[] = [];
  const stack: [unknown, string][] = [[value, '']];
  const join = (path: string, key: string): string => (path === '' ? key : `${path}.${key}`);
  while (stack.length > 0 && problems.length < max) {
    const [item, path] = stack.pop()!;
    if (typeof item === 'string') {
      const found = firstControl(item);
      if (found) problems.push({ field: path || '(body)', message: controlMessage(path || 'the body', found) });
    } else if (Array.isArray(item)) {
      for (let i = item.length - 1; i >= 0; i--) stack.push([item[i], join(path, String(i))]);
    } else if (item !== null && typeof item === 'object') {
      const entries = Object.entries(item);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, child] = entries[i]!;
        const found = firstControl(key);
        if (found) {
          const field = join(path, showControls(key));
          problems.push({ field, message: `the field name ${field} must not contain control characters (it holds ${found})` });
        } else stack.push([child, join(path, key)]);
      }
    }
  }
  return problems;
}

/** Deepest nesting any request body may have: a requirement set with per-scheme part overrides needs 5. */
export const MAX_JSON_DEPTH = 32;

/**
 * True when the JSON text nests arrays and objects deeper than `limit`. One pass over the characters, brackets
 * inside strings skipped, before JSON.parse and the schemas (which recurse) ever see the text.
 */
export function nestsDeeperThan(text: string, limit: number = MAX_JSON_DEPTH): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > limit) return true;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return false;
}
