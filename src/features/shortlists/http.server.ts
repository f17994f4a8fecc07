import { ShortlistRuleError } from '../../db/queries/shortlists';
import { problem } from '../../lib/server/http';

/** Runs a workflow step; a broken rule becomes its HTTP reply, anything else is rethrown. */
export async function ruled(step: () => Promise<Response>): Promise<Response> {
  try {
    return await step();
  } catch (error) {
    if (error instanceof ShortlistRuleError) return problem(error.status, error.message);
    throw error;
  }
}
