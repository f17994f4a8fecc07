import { useState } from 'react';
import type { UserJson } from './user-json';

type Role = UserJson['role'];
const ROLE_OPTIONS: { value: Role; label: string }[] = [
  { value: 'admin', label: 'Admin' },
  { value: 'architect', label: 'Architect' },
  { value: 'engineer', label: 'Engineer' },
  { value: 'sales', label: 'Sales' },
];

interface Props {
  initialUsers: UserJson[];
  currentUserId: string;
}

interface Problem {
  error: string;
  fields?: { field: string; message: string }[];
}

async function send(url: string, method: string, body: unknown): Promise<{ ok: true; data: UserJson } | { ok: false; problem: Problem }> {
  try {
    const response = await fetch(url, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    const data = (await response.json()) as UserJson | Problem;
    return response.ok ? { ok: true, data: data as UserJson } : { ok: false, problem: data as Problem };
  } catch {
    return { ok: false, problem: { error: 'The server could not be reached. Try again.' } };
  }
}

const emptyForm = { email: '', name: '', role: 'engineer' as Role, password: '' };

/** Team members: add a member, change a role, deactivate or reactivate (admins only). */
export default function TeamManager({ initialUsers, currentUserId }: Props) {
  const [users, setUsers] = useState(initialUsers);
  const [form, setForm] = useState(emptyForm);
  const [formProblem, setFormProblem] = useState<Problem | null>(null);
  const [rowMessage, setRowMessage] = useState<{ id: string; text: string; error: boolean } | null>(null);
  const [busy, setBusy] = useState(false);

  const fieldError = (name: string) => formProblem?.fields?.find((f) => f.field === name)?.message;
  const replace = (updated: UserJson) => setUsers((list) => list.map((u) => (u.id === updated.id ? updated : u)));

  async function addMember(event: { preventDefault(): void }) {
    event.preventDefault();
    setBusy(true);
    setFormProblem(null);
    const result = await send('/api/v1/users', 'POST', form);
    setBusy(false);
    if (!result.ok) return setFormProblem(result.problem);
    setUsers((list) => [...list, result.data].sort((a, b) => a.name.localeCompare(b.name)));
    setForm(emptyForm);
    setRowMessage({ id: result.data.id, text: `${result.data.name} added.`, error: false });
  }

  async function patch(user: UserJson, change: { role?: Role; active?: boolean }, done: string) {
    const result = await send(`/api/v1/users/${encodeURIComponent(user.id)}`, 'PATCH', change);
    if (!result.ok) return setRowMessage({ id: user.id, text: result.problem.error, error: true });
    replace(result.data);
    setRowMessage({ id: user.id, text: done, error: false });
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
      <section className="card overflow-x-auto" aria-labelledby="members-title">
        <h2 id="members-title" className="border-b border-line px-4 py-3 font-semibold">Members ({users.length})</h2>
        <table className="table-eng">
          <thead>
            <tr>
              <th scope="col">Name</th>
              <th scope="col">E-mail</th>
              <th scope="col">Role</th>
              <th scope="col">Status</th>
              <th scope="col"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {users.map((user) => (
              <tr key={user.id} data-member={user.email} className={user.active ? '' : 'text-muted'}>
                <td className="font-medium">
                  {user.name}
                  {user.id === currentUserId && <span className="ml-1 text-xs text-muted">(you)</span>}
                  {rowMessage?.id === user.id && (
                    <p role="status" className={`mt-1 text-xs ${rowMessage.error ? 'text-fail' : 'text-ok'}`}>{rowMessage.text}</p>
                  )}
                </td>
                <td>{user.email}</td>
                <td>
                  <label className="sr-only" htmlFor={`role-${user.id}`}>Role of {user.name}</label>
                  <select
                    id={`role-${user.id}`} className="field py-1" value={user.role}
                    onChange={(e) => patch(user, { role: e.target.value as Role }, `Role changed to ${e.target.value}.`)}
                  >
                    {ROLE_OPTIONS.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
                  </select>
                </td>
                <td>
                  <span className={`rounded px-1.5 py-0.5 text-xs font-semibold ${user.active ? 'bg-ok-soft text-ok' : 'bg-canvas text-muted'}`}>
                    {user.active ? 'Active' : 'Deactivated'}
                  </span>
                </td>
                <td className="text-right">
                  {user.id !== currentUserId && (
                    <button
                      type="button" className="btn py-1 text-xs"
                      onClick={() => patch(user, { active: !user.active }, user.active ? 'Deactivated; signed out everywhere.' : 'Reactivated.')}
                    >
                      {user.active ? 'Deactivate' : 'Reactivate'}
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <section className="card p-4" aria-labelledby="add-title">
        <h2 id="add-title" className="mb-3 font-semibold">Add a member</h2>
        <form onSubmit={addMember} className="space-y-3" noValidate>
          {(['name', 'email', 'password'] as const).map((name) => (
            <div key={name}>
              <label className="label" htmlFor={`new-${name}`}>
                {name === 'name' ? 'Display name' : name === 'email' ? 'E-mail' : 'Initial password (10+ characters)'}
              </label>
              <input
                id={`new-${name}`} className="field" autoComplete="off"
                type={name === 'password' ? 'password' : name === 'email' ? 'email' : 'text'}
                value={form[name]} onChange={(e) => setForm({ ...form, [name]: e.target.value })}
                aria-invalid={fieldError(name) ? true : undefined}
              />
              {fieldError(name) && <p className="mt-1 text-sm text-fail">{fieldError(name)}</p>}
            </div>
          ))}
          <div>
            <label className="label" htmlFor="new-role">Role</label>
            <select id="new-role" className="field" value={form.role} onChange={(e) => setForm({ ...form, role: e.target.value as Role })}>
              {ROLE_OPTIONS.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
            </select>
          </div>
          {formProblem && !formProblem.fields && <p role="alert" className="text-sm text-fail">{formProblem.error}</p>}
          <button type="submit" className="btn btn-primary w-full justify-center" disabled={busy}>
            {busy ? 'Adding…' : 'Add member'}
          </button>
        </form>
      </section>
    </div>
  );
}
