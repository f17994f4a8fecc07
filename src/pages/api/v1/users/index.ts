import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../lib/server/http';
import { hashPassword } from '../../../../lib/server/password';
import { newUserSchema } from '../../../../schemas/auth';
import { createUser, DuplicateEmailError, listUsers } from '../../../../db/queries/users';
import { toUserJson } from '../../../../features/team/user-json';

export const GET: APIRoute = async ({ locals }) => {
  const user = authorize(locals, 'manageTeam');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  return json({ users: (await listUsers(db)).map(toUserJson) });
};

/** `{email, name, role, password}` → the new member (admins only). */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'manageTeam');
  if (user instanceof Response) return user;
  const body = await readJson(request, newUserSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  try {
    const created = await createUser(
      db,
      { email: body.data.email, displayName: body.data.name, role: body.data.role, passwordHash: await hashPassword(body.data.password) },
      user.id,
    );
    return json(toUserJson(created), 201);
  } catch (error) {
    if (error instanceof DuplicateEmailError) return problem(409, 'A member with this e-mail already exists.', [{ field: 'email', message: 'already in use' }]);
    throw error;
  }
};
