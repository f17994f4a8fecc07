import { controlMessage, firstControl, showControls } from '../text-guard';
import type { FieldProblem } from './http';

export type AddressProblem = { kind: 'none' } | { kind: 'path' } | { kind: 'query'; fields: FieldProblem[] };

/**
 * The one guard for what arrives in a request's address, before any route reads it: a path segment (an id in
 * `/api/v1/specs/:id`, `/compare/:id`) holding a control character, or not decodable, names nothing that can
 * exist (404); a query parameter holding one is a 400 naming the parameter. PostgreSQL refuses U+0000 in text,
 * so without this an id went to the database and came back as a 500.
 */
export function addressProblems(url: URL): AddressProblem {
  for (const segment of url.pathname.split('/')) {
    if (!segment.includes('%')) continue;
    let decoded: string;
    try {
      decoded = decodeURIComponent(segment);
    } catch {
      return { kind: 'path' };
    }
    if (firstControl(decoded)) return { kind: 'path' };
  }
  const fields: FieldProblem[] = [];
  for (const [key, value] of url.searchParams) {
    const inKey = firstControl(key);
    const found = inKey ?? firstControl(value);
    if (found) {
      const field = showControls(key);
      fields.push({ field, message: inKey ? `the query parameter name ${field} must not contain control characters (it holds ${found})` : controlMessage(field, found) });
    }
  }
  return fields.length > 0 ? { kind: 'query', fields } : { kind: 'none' };
}
