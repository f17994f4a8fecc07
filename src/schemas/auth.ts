import './zod-browser';
import { z } from 'zod';
import { ROLES } from '../lib/roles';

const email = z
  .string({ error: 'email is required and must be text' })
  .trim()
  .max(254, { error: 'email must have at most 254 characters' })
  .pipe(z.email({ error: 'email must be an e-mail address such as name@example.com' }));

export const signInSchema = z.strictObject(
  {
    email,
    password: z
      .string({ error: 'password is required and must be text' })
      .min(1, { error: 'password is required' })
      .max(1024, { error: 'password must have at most 1024 characters' }),
  },
  { error: (issue) => (issue.code === 'unrecognized_keys' ? `unknown field(s): ${issue.keys.join(', ')}` : 'send an object with email and password') },
);
export type SignInInput = z.infer<typeof signInSchema>;

const role = z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` });

export const newUserSchema = z.strictObject(
  {
    email,
    name: z
      .string({ error: 'name is required and must be text' })
      .trim()
      .min(1, { error: 'name is required' })
      .max(120, { error: 'name must have at most 120 characters' }),
    role,
    password: z
      .string({ error: 'password is required and must be text' })
      .min(10, { error: 'password must have at least 10 characters' })
      .max(1024, { error: 'password must have at most 1024 characters' }),
  },
  { error: (issue) => (issue.code === 'unrecognized_keys' ? `unknown field(s): ${issue.keys.join(', ')}` : 'send an object with email, name, role and password') },
);
export type NewUserInput = z.infer<typeof newUserSchema>;

export const userPatchSchema = z
  .strictObject(
    {
      role: role.optional(),
      active: z.boolean({ error: 'active must be true or false' }).optional(),
    },
    { error: (issue) => (issue.code === 'unrecognized_keys' ? `unknown field(s): ${issue.keys.join(', ')}` : 'send an object with role and/or active') },
  )
  .refine((p) => p.role !== undefined || p.active !== undefined, { error: 'send role, active, or both' });
export type UserPatchInput = z.infer<typeof userPatchSchema>;
