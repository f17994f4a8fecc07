import { useState } from 'react';
import { safeNext } from '../../lib/next-path';

interface DemoLogin {
  email: string;
  name: string;
  roleLabel: string;
}

interface Props {
  next: string;
  demoLogins: DemoLogin[];
  demoPassword: string | null;
  /** Message from a plain form post that came back (before the script had loaded). */
  initialError: string | null;
}

interface Problem {
  error: string;
  fields?: { field: string; message: string }[];
}


export default function SignInForm({ next, demoLogins, demoPassword, initialError }: Props) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<Problem | null>(initialError ? { error: initialError } : null);

  const fieldError = (name: string) => problem?.fields?.find((f) => f.field === name)?.message;

  async function submit(event: { preventDefault(): void }) {
    event.preventDefault();
    setBusy(true);
    setProblem(null);
    try {
      const response = await fetch('/api/v1/auth/sign-in', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password }),
      });
      if (response.ok) {
        window.location.assign(safeNext(next, window.location.origin));
        return;
      }
      setProblem((await response.json()) as Problem);
    } catch {
      setProblem({ error: 'The server could not be reached. Check the connection and try again.' });
    }
    setBusy(false);
  }

  return (
    <div className="space-y-6">
      {/* Works as a plain form post too, so a click before the script loads still signs in. */}
      <form onSubmit={submit} method="post" action="/api/v1/auth/sign-in" className="space-y-4" noValidate>
        {/* `next` comes checked by the page (safeNext against this server's origin); the API checks it again. */}
        <input type="hidden" name="next" value={next} />
        <div>
          <label className="label" htmlFor="email">E-mail</label>
          <input
            id="email" name="email" type="email" autoComplete="username" required className="field"
            value={email} onChange={(e) => setEmail(e.target.value)}
            aria-invalid={fieldError('email') ? true : undefined} aria-describedby="email-error"
          />
          {fieldError('email') && <p id="email-error" className="mt-1 text-sm text-fail">{fieldError('email')}</p>}
        </div>
        <div>
          <label className="label" htmlFor="password">Password</label>
          <input
            id="password" name="password" type="password" autoComplete="current-password" required className="field"
            value={password} onChange={(e) => setPassword(e.target.value)}
            aria-invalid={fieldError('password') ? true : undefined} aria-describedby="password-error"
          />
          {fieldError('password') && <p id="password-error" className="mt-1 text-sm text-fail">{fieldError('password')}</p>}
        </div>
        {problem && !problem.fields && (
          <p role="alert" className="rounded-md border border-fail/30 bg-fail-soft px-3 py-2 text-sm text-fail">{problem.error}</p>
        )}
        <button type="submit" className="btn btn-primary w-full justify-center" disabled={busy}>
          {busy ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
      {demoPassword && demoLogins.length > 0 && (
        <section aria-labelledby="demo-logins" className="rounded-md border border-line bg-canvas p-3">
          <h2 id="demo-logins" className="text-sm font-semibold">Demo accounts</h2>
          <p className="mb-2 text-xs text-muted">
            Invented team of the demo workspace. Password for all: <code className="font-semibold text-ink">{demoPassword}</code>
          </p>
          <ul className="divide-y divide-line text-sm">
            {demoLogins.map((login) => (
              <li key={login.email} className="flex items-center justify-between gap-3 py-1.5">
                <span className="min-w-0">
                  <span className="block font-medium">{login.roleLabel}</span>
                  <span className="block truncate text-xs text-muted">{login.email}</span>
                </span>
                <button
                  type="button" className="btn shrink-0 py-0.5 text-xs"
                  onClick={() => { setEmail(login.email); setPassword(demoPassword); setProblem(null); }}
                  aria-label={`Fill in ${login.email}`}
                >
                  Use
                </button>
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
