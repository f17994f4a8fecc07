import type { PublicUser } from '../../db/queries/users';

export interface UserJson {
  id: string;
  email: string;
  name: string;
  role: PublicUser['role'];
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

/** The API's shape of a member: never the password hash. */
export function toUserJson(u: PublicUser): UserJson {
  return {
    id: u.id, email: u.email, name: u.displayName, role: u.role, active: u.active,
    createdAt: u.createdAt.toISOString(), updatedAt: u.updatedAt.toISOString(),
  };
}
