import type { APIRoute } from 'astro';
import { authorize } from '../../../../lib/server/guard';
import { json } from '../../../../lib/server/http';

/** The signed-in member, for scripts and islands. */
export const GET: APIRoute = ({ locals }) => {
  const user = authorize(locals);
  if (user instanceof Response) return user;
  return json({ user: { id: user.id, email: user.email, name: user.displayName, role: user.role } });
};
