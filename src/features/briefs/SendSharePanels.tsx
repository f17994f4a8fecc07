import { useId, useState } from 'react';

export interface Problem {
  error: string;
  fields?: { field: string; message: string }[] | undefined;
}

export interface SendForm {
  to: string;
  cc: string;
  message: string;
}

export interface IssuedLink {
  url: string;
  expiresAt: string;
  version: number;
  note: string;
}

const fieldOf = (p: Problem | null, name: string): string | undefined =>
  p?.fields?.filter((f) => f.field === name || f.field.startsWith(`${name}.`)).map((f) => f.message).join('; ') || undefined;

/** To, Cc and a personal note; sending freezes the next version and mails its link. */
export function SendPanel({ onSend, busy, problem, dirty }: { onSend(form: SendForm): void; busy: boolean; problem: Problem | null; dirty: boolean }) {
  const [form, setForm] = useState<SendForm>({ to: '', cc: '', message: '' });
  const id = useId();
  const toError = fieldOf(problem, 'to');
  const ccError = fieldOf(problem, 'cc');
  return (
    <form className="space-y-2" onSubmit={(e) => { e.preventDefault(); onSend(form); }} data-send-form>
      <div>
        <label htmlFor={`${id}-to`} className="label">To</label>
        <input id={`${id}-to`} className="field" type="text" inputMode="email" autoComplete="email" placeholder="name@customer.example" value={form.to}
          onChange={(e) => setForm({ ...form, to: e.target.value })} aria-invalid={toError ? true : undefined} aria-describedby={toError ? `${id}-to-error` : undefined} required />
        {toError && <p id={`${id}-to-error`} className="mt-1 text-xs text-fail">{toError}</p>}
      </div>
      <div>
        <label htmlFor={`${id}-cc`} className="label">Cc (optional)</label>
        <input id={`${id}-cc`} className="field" type="text" inputMode="email" placeholder="separate addresses with commas" value={form.cc}
          onChange={(e) => setForm({ ...form, cc: e.target.value })} aria-invalid={ccError ? true : undefined} aria-describedby={ccError ? `${id}-cc-error` : undefined} />
        {ccError && <p id={`${id}-cc-error`} className="mt-1 text-xs text-fail">{ccError}</p>}
      </div>
      <div>
        <label htmlFor={`${id}-msg`} className="label">Personal note (optional)</label>
        <textarea id={`${id}-msg`} className="field min-h-16" value={form.message} onChange={(e) => setForm({ ...form, message: e.target.value })} />
      </div>
      <button type="submit" className="btn btn-primary" disabled={busy}>{busy ? 'Sending…' : dirty ? 'Save and send' : 'Send brief'}</button>
      <p className="text-xs text-muted">Sending freezes this brief as a new version and mails a read-only link to it (valid 30 days).</p>
    </form>
  );
}

/** A new read-only link (shown once; only its hash is kept) and revoking every live link. */
export function SharePanel({ onShare, onRevoke, busy, activeLinks }: { onShare(days: number): void; onRevoke(): void; busy: boolean; activeLinks: number }) {
  const [days, setDays] = useState('30');
  const id = useId();
  const valid = /^\d+$/.test(days) && Number(days) >= 1 && Number(days) <= 365;
  return (
    <div className="space-y-2" data-share-panel>
      <div className="flex items-end gap-2">
        <div>
          <label htmlFor={`${id}-days`} className="label">Valid for, days</label>
          <input id={`${id}-days`} className="field w-24" type="number" min={1} max={365} value={days} onChange={(e) => setDays(e.target.value)} aria-invalid={valid ? undefined : true} />
        </div>
        <button type="button" className="btn" disabled={busy || !valid} onClick={() => onShare(Number(days))}>Create share link</button>
      </div>
      {!valid && <p className="text-xs text-fail">Enter a whole number of days from 1 to 365.</p>}
      <div className="flex items-center gap-2">
        <button type="button" className="btn text-fail" disabled={busy || activeLinks === 0} onClick={onRevoke} data-revoke-all>Revoke all links</button>
        <span className="text-xs text-muted">{activeLinks === 0 ? 'No live links.' : `${activeLinks} live link${activeLinks === 1 ? '' : 's'}.`}</span>
      </div>
    </div>
  );
}

/** The link just issued, with a copy button; it cannot be shown again later. */
export function IssuedLinkNote({ link }: { link: IssuedLink }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="space-y-1 rounded-md border border-ok/40 bg-ok-soft px-3 py-2 text-sm" role="status" data-issued-link>
      <p>{link.note}</p>
      <p className="break-all font-mono text-xs" data-share-url>{link.url}</p>
      <p className="text-xs text-muted">Version {link.version}; works until {link.expiresAt.slice(0, 10)}. Copy it now: only its fingerprint is stored.</p>
      <button type="button" className="btn text-xs" onClick={() => { void navigator.clipboard?.writeText(link.url).then(() => setCopied(true)); }}>{copied ? 'Copied' : 'Copy link'}</button>
    </div>
  );
}
