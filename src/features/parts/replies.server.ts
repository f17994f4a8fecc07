import { json, problem } from '../../lib/server/http';
import type { EditOutcome } from './edit.server';

/** The HTTP reply of a library write: 200/201 with the new version, or the reason it was refused. */
export function editReply(outcome: EditOutcome, createdStatus = 200): Response {
  switch (outcome.kind) {
    case 'written':
      return json({ version: outcome.version, changes: outcome.changes, uploadId: outcome.uploadId }, createdStatus);
    case 'unchanged':
      return json({ version: outcome.version, changes: [], uploadId: null });
    case 'invalid':
      return problem(400, outcome.message, outcome.fields);
    case 'missing':
      return problem(404, 'No part with this id in the current library.');
    case 'duplicate':
      return problem(409, outcome.message);
    case 'stale':
      return json({ error: `The parts library changed meanwhile (now version ${outcome.currentVersion}); reload and try again.`, currentVersion: outcome.currentVersion }, 409);
  }
}
