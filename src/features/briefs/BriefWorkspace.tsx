import { useState } from 'react';
import { api } from '../../lib/api-client';
import type { BriefJson, BriefVersionJson } from './brief-json';
import BriefDocument from './BriefDocument';
import BriefEditor, { type EditorForm } from './BriefEditor';
import { IssuedLinkNote, SendPanel, SharePanel, type IssuedLink, type Problem, type SendForm } from './SendSharePanels';

interface Props {
  initial: BriefJson;
  canWrite: boolean;
  /** Where captured mail can be read (admins in demo mode), if anywhere. */
  outboxHref: string | null;
  /** A frozen version to show first (`?version=N`). */
  initialVersion?: number | null;
}

const formOf = (b: BriefJson): EditorForm => ({
  title: b.title,
  customerName: b.customerName,
  customerContact: b.customerContact,
  summary: b.draft.summary ?? b.preview.summary,
  recommendedScheme: b.draft.recommendedScheme ?? '',
  contingencyLowPct: String(b.draft.contingencyLowPct),
  contingencyHighPct: String(b.draft.contingencyHighPct),
  risksText: b.draft.risksText,
  assumptionsText: b.draft.assumptionsText,
});

const asNumber = (s: string): number | string => (s.trim() !== '' && Number.isFinite(Number(s)) ? Number(s) : s);
const activeLinks = (versions: BriefVersionJson[]): number =>
  versions.flatMap((v) => v.shares).filter((s) => s.revokedAt === null && Date.parse(s.expiresAt) > Date.now()).length;
const when = (iso: string): string => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

/** The brief screen: editor, send and share on the left, the document (draft or a frozen version) on the right. */
export default function BriefWorkspace({ initial, canWrite, outboxHref, initialVersion = null }: Props) {
  const [brief, setBrief] = useState(initial);
  const [form, setForm] = useState(() => formOf(initial));
  const [summaryGenerated, setSummaryGenerated] = useState(initial.draft.summary === null);
  const [dirty, setDirty] = useState(false);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<Problem | null>(null);
  const [sendProblem, setSendProblem] = useState<Problem | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [link, setLink] = useState<IssuedLink | null>(null);
  const [viewing, setViewing] = useState<number | null>(initialVersion);

  const shown = viewing === null ? null : brief.versions.find((v) => v.version === viewing) ?? null;
  const defaultScheme = brief.preview.recommended && brief.draft.recommendedScheme === null ? ` (now ${brief.preview.recommended.label})` : '';
  const defaultLabel = `${brief.shortlistId ? 'Decided on the shortlist, else best feasible' : "Engine's best feasible"}${defaultScheme}`;

  async function refresh(): Promise<void> {
    const result = await api<BriefJson>('GET', `/api/v1/briefs/${encodeURIComponent(brief.id)}`);
    if (result.ok) setBrief(result.data);
  }

  async function save(): Promise<boolean> {
    setBusy(true);
    setProblem(null);
    const body = {
      title: form.title, customerName: form.customerName, customerContact: form.customerContact,
      summary: summaryGenerated ? null : form.summary,
      recommendedScheme: form.recommendedScheme === '' ? null : form.recommendedScheme,
      contingencyLowPct: asNumber(form.contingencyLowPct), contingencyHighPct: asNumber(form.contingencyHighPct),
      risksText: form.risksText, assumptionsText: form.assumptionsText,
    };
    const result = await api<BriefJson>('PUT', `/api/v1/briefs/${encodeURIComponent(brief.id)}`, body);
    setBusy(false);
    if (!result.ok) {
      setProblem(result.problem);
      return false;
    }
    setBrief(result.data);
    if (summaryGenerated) setForm((f) => ({ ...f, summary: result.data.preview.summary }));
    setDirty(false);
    setViewing(null);
    setMessage('Draft saved; the document shows it.');
    return true;
  }

  async function send(sendForm: SendForm): Promise<void> {
    setSendProblem(null);
    setMessage(null);
    if (dirty && !(await save())) return;
    setBusy(true);
    const body = { to: sendForm.to, ...(sendForm.cc.trim() ? { cc: sendForm.cc } : {}), ...(sendForm.message.trim() ? { message: sendForm.message } : {}) };
    const result = await api<{ version: number; sentTo: string[]; share: { url: string; expiresAt: string }; mail: { status: string } }>('POST', `/api/v1/briefs/${encodeURIComponent(brief.id)}/send`, body);
    setBusy(false);
    if (!result.ok) {
      setSendProblem(result.problem);
      if (result.problem.status === 502) await refresh(); // the version and its link were made all the same
      return;
    }
    const where = result.data.mail.status === 'captured' ? ' It was captured by the local mail server (demo mode) and is listed in the Outbox.' : '';
    setLink({ url: result.data.share.url, expiresAt: result.data.share.expiresAt, version: result.data.version, note: `Version ${result.data.version} sent to ${result.data.sentTo.join(', ')}.${where}` });
    await refresh();
  }

  async function share(days: number): Promise<void> {
    if (dirty && !(await save())) return;
    setBusy(true);
    const result = await api<{ version: number; frozeNewVersion: boolean; share: { url: string; expiresAt: string } }>('POST', `/api/v1/briefs/${encodeURIComponent(brief.id)}/share`, { expiresInDays: days });
    setBusy(false);
    if (!result.ok) return setMessage(result.problem.error);
    setLink({ url: result.data.share.url, expiresAt: result.data.share.expiresAt, version: result.data.version, note: result.data.frozeNewVersion ? `Froze version ${result.data.version} and made a read-only link to it.` : `New read-only link to version ${result.data.version}.` });
    await refresh();
  }

  async function revoke(): Promise<void> {
    if (!window.confirm('Revoke every live link of this brief? Anyone holding one will see "link withdrawn".')) return;
    setBusy(true);
    const result = await api<{ revoked: number }>('DELETE', `/api/v1/briefs/${encodeURIComponent(brief.id)}/share`);
    setBusy(false);
    setLink(null);
    setMessage(result.ok ? `${result.data.revoked} link${result.data.revoked === 1 ? '' : 's'} revoked.` : result.problem.error);
    await refresh();
  }

  const fieldError = (name: string) => problem?.fields?.find((f) => f.field === name)?.message;

  return (
    <div className="grid gap-6 xl:grid-cols-[24rem_minmax(0,1fr)] print:block">
      <aside className="space-y-4" data-print-hidden aria-label="Brief tools">
        {canWrite ? (
          <section className="card space-y-3 p-4" aria-labelledby="edit-title">
            <h2 id="edit-title" className="font-semibold">Edit the draft</h2>
            {problem && <p className="rounded bg-fail-soft px-3 py-2 text-sm text-fail" role="alert">{problem.error}</p>}
            <BriefEditor form={form} busy={busy} dirty={dirty} verdicts={brief.preview.verdicts} defaultLabel={defaultLabel} fieldError={fieldError}
              onChange={(change) => { setForm((f) => ({ ...f, ...change })); setDirty(true); if ('summary' in change) setSummaryGenerated(false); }}
              onSave={() => void save()}
              onResetSummary={() => { setSummaryGenerated(true); setForm((f) => ({ ...f, summary: brief.preview.summary })); setDirty(true); }} />
          </section>
        ) : (
          <p className="card p-4 text-sm text-muted" data-read-only>You can read briefs; sales, architects and admins edit, send and share them.</p>
        )}
        {canWrite && (
          <section className="card space-y-3 p-4" aria-labelledby="send-title">
            <h2 id="send-title" className="font-semibold">Send to the customer</h2>
            {sendProblem && <p className="rounded bg-fail-soft px-3 py-2 text-sm text-fail" role="alert">{sendProblem.error}</p>}
            <SendPanel onSend={(f) => void send(f)} busy={busy} problem={sendProblem} dirty={dirty} />
            {outboxHref && <p className="text-xs text-muted">Demo mode: mail stops at the local capture server. <a className="text-accent hover:underline" href={outboxHref}>Open the Outbox</a>.</p>}
          </section>
        )}
        {canWrite && (
          <section className="card space-y-3 p-4" aria-labelledby="share-title">
            <h2 id="share-title" className="font-semibold">Share link</h2>
            <SharePanel onShare={(d) => void share(d)} onRevoke={() => void revoke()} busy={busy} activeLinks={activeLinks(brief.versions)} />
          </section>
        )}
        {link && <IssuedLinkNote link={link} />}
        {message && <p className="text-sm text-muted" role="status">{message}</p>}
        <section className="card p-4" aria-labelledby="versions-title">
          <h2 id="versions-title" className="mb-2 font-semibold">Versions</h2>
          {brief.versions.length === 0 ? <p className="text-sm text-muted">Not sent yet. Each send freezes a version here.</p> : (
            <ul className="space-y-2 text-sm" data-versions>
              {brief.versions.map((v) => (
                <li key={v.version} className="flex flex-wrap items-baseline gap-x-2" data-version={v.version}>
                  <button type="button" className={`font-semibold hover:underline ${viewing === v.version ? 'text-accent-strong' : 'text-accent'}`} onClick={() => setViewing(v.version)} aria-pressed={viewing === v.version}>Version {v.version}</button>
                  <span className="text-muted">{v.sentAt ? `sent ${when(v.sentAt)} to ${v.sentTo}${v.sentBy ? ` by ${v.sentBy}` : ''}` : `frozen ${when(v.frozenAt)} for a link`}</span>
                  <span className="w-full text-xs text-muted">
                    {v.shares.length === 0 ? 'no link' : v.shares.map((s) => `link ${s.revokedAt ? 'revoked' : Date.parse(s.expiresAt) <= Date.now() ? 'expired' : `live until ${s.expiresAt.slice(0, 10)}`}, ${s.views} view${s.views === 1 ? '' : 's'}`).join(' · ')}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </section>
      </aside>
      <div className="min-w-0 space-y-2">
        <div className="flex flex-wrap items-center justify-between gap-2" data-print-hidden>
          <p className="text-sm text-muted">
            {shown ? <>Showing version {shown.version} as it went out. <button type="button" className="text-accent hover:underline" onClick={() => setViewing(null)}>Back to the current draft</button></> : 'Showing the current draft, computed from the saved requirement set now.'}
          </p>
          <button type="button" className="btn" onClick={() => window.print()}>Print or save as PDF</button>
        </div>
        <BriefDocument content={shown ? shown.content : brief.preview} issue={shown ? { kind: 'version', version: shown.version, date: (shown.sentAt ?? shown.frozenAt).slice(0, 10) } : { kind: 'draft' }} />
      </div>
    </div>
  );
}
