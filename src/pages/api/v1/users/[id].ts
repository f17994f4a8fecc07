import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../lib/server/http';
import { userPatchSchema } from '../../../../schemas/auth';
import { LastAdminError, updateUser } from '../../../../db/queries/users';
import { toUserJson } from '../../../../features/team/user-json';

/** `{role?, active?}` (admins only). Deactivating ends that member's sessions at once. */
export const PATCH: APIRoute = async ({ locals, request, params }) => {
  const user = authorize(locals, 'manageTeam');
  if (user instanceof Response) return user;
  const body = await readJson(request, userPatchSchema);
  if (!body.ok) return body.response;
  const { db, sessions } = await getApp();
  try {
    const updated = await updateUser(db, params.id ?? '', body.data, user.id);
    if (!updated) return problem(404, 'No member with this id.');
    sessions.forgetUser(updated.id); // the new role (or the end of the sessions) applies to the next request

    return json(toUserJson(updated));
  } catch (error) {
    if (error instanceof LastAdminError) return problem(409, 'The team needs at least one active admin; make someone else admin first.');
    throw error;
  }
};
