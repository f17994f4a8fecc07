import SafetyCautionText from '../../components/SafetyCautionText';
import { VERDICT_LABELS, type Verdict } from '../../lib/verdict';
import type { BriefContent, BriefLine } from '../../schemas/brief-content';
import { formatCount, formatMoney } from '../../lib/format';
import { COST_NOTICE, ESTIMATE_NOTICE } from './notices';
import StressChart from './StressChart';

export type BriefIssue = { kind: 'draft' } | { kind: 'version'; version: number; date: string };

const VERDICT_CLASS: Record<Verdict, string> = {
  feasible: 'bg-ok-soft text-ok border-ok/40',
  marginal: 'bg-warn-soft text-warn border-warn/40',
  'not-feasible': 'bg-fail-soft text-fail border-fail/40',
};

const SOURCE_TEXT = {
  engine: 'the best feasible scheme in the engine ranking (a weighted score of switch voltage stress, duty headroom, part count, cost and efficiency)',
  edited: 'chosen by the author of this brief',
  shortlist: 'decided by our engineering team on a shortlist ballot',
} as const;

function VerdictBadge({ verdict }: { verdict: Verdict }) {
  return <span className={`inline-block whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-semibold ${VERDICT_CLASS[verdict]}`} data-verdict={verdict}>{VERDICT_LABELS[verdict]}</span>;
}

function Lines({ lines, testId }: { lines: BriefLine[]; testId: string }) {
  return (
    <dl className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)] border-t border-line text-sm" data-lines={testId}>
      {lines.map((l) => (
        <div key={l.label} className="contents">
          <dt className="border-b border-line/70 py-1.5 pr-3 text-muted">{l.label}</dt>
          <dd className="border-b border-line/70 py-1.5 font-medium">{l.value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** `keep`: print the section on one page when it fits (short sections); long ones may split between rows. */
function Section({ title, children, id, keep = true }: { title: string; children: React.ReactNode; id: string; keep?: boolean }) {
  return (
    <section className={`${keep ? 'brief-keep ' : ''}brief-section space-y-2`} data-brief-section={id}>
      <h2 className="brief-h2 text-base font-semibold text-accent-strong">{title}</h2>
      {children}
    </section>
  );
}

/**
 * The customer-facing brief. Plain render (no state), so it serves the editor preview, frozen
 * versions and the signed-out share page alike, and prints the same on A4 and Letter.
 */
export default function BriefDocument({ content: c, issue }: { content: BriefContent; issue: BriefIssue }) {
  return (
    <article className="brief-doc card space-y-5 px-8 py-7" data-brief-document data-brief-issue={issue.kind === 'draft' ? 'draft' : String(issue.version)}>
      <header className="space-y-1 border-b border-line pb-4">
        <p className="text-xs font-semibold tracking-wide text-muted uppercase">
          Feasibility brief{c.preparedBy.company ? ` · ${c.preparedBy.company}` : ''}
        </p>
        <h1 className="text-2xl font-semibold tracking-tight" data-brief-title>{c.title}</h1>
        <p className="text-sm">
          For <strong data-brief-customer>{c.customerName}</strong>{c.customerContact && <> · {c.customerContact}</>}
        </p>
        <p className="text-sm text-muted">
          Prepared by {c.preparedBy.name}{c.preparedBy.email && ` (${c.preparedBy.email})`} ·{' '}
          {issue.kind === 'draft' ? <span className="font-semibold text-warn">Draft, not sent</span> : <>Version {issue.version}, {issue.date}</>}
        </p>
      </header>

      <p className="brief-notice rounded-md border border-accent/30 bg-accent-soft px-4 py-2.5 text-sm font-medium text-accent-strong" data-estimate-notice>
        {ESTIMATE_NOTICE}
      </p>
      {c.notices.map((n) => <p key={n} className="rounded-md bg-warn-soft px-3 py-2 text-sm text-warn" data-brief-notice>{n}</p>)}

      <Section title="Summary" id="summary">
        {c.summary.split(/\n\s*\n/).map((para, i) => <p key={i} className="text-sm leading-relaxed whitespace-pre-line" data-brief-summary>{para}</p>)}
      </Section>

      <Section title="Your requirements" id="requirements">
        <Lines lines={c.requirements} testId="requirements" />
      </Section>

      <Section title="Verdict per core-reset scheme" id="verdicts" keep={false}>
        <table className="table-eng brief-table">
          <thead><tr><th className="w-40">Scheme</th><th className="w-28">Verdict</th><th>Why</th></tr></thead>
          <tbody>
            {c.verdicts.map((v) => (
              <tr key={v.scheme} data-brief-verdict={v.scheme}>
                <td className="font-medium">{v.label}{c.recommended?.scheme === v.scheme && <span className="block text-xs font-normal text-accent">recommended</span>}</td>
                <td><VerdictBadge verdict={v.verdict} /></td>
                <td><ul className="space-y-0.5">{v.reasons.map((r) => <li key={r}>{r}</li>)}</ul></td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="text-xs text-muted">
          Feasible: every checked limit holds with margin. Marginal: feasible, but a figure is close to a limit or misses a target.
          Not feasible: a limit is broken with the parts in our library.
        </p>
        <StressChart bars={c.chart} />
      </Section>

      {c.recommended ? (
        <Section title={`Recommendation: ${c.recommended.label}`} id="recommendation">
          <p className="text-sm">
            <VerdictBadge verdict={c.recommended.verdict} /> <span className="text-muted">— {SOURCE_TEXT[c.recommended.source]}{c.shortlist && c.recommended.source === 'shortlist' ? ` ("${c.shortlist.title}")` : ''}.</span>
          </p>
          {c.shortlist?.rationale && c.recommended.source === 'shortlist' && <p className="text-sm italic">“{c.shortlist.rationale}”</p>}
          <Lines lines={c.recommended.figures} testId="key-figures" />
        </Section>
      ) : (
        <Section title="Recommendation" id="recommendation">
          <p className="text-sm">No scheme is feasible for the requirements as stated. We suggest discussing which requirement could move.</p>
        </Section>
      )}

      {c.cost && (
        <Section title="Indicative unit cost" id="cost">
          <p className="text-lg font-semibold" data-cost-band>
            {formatMoney(c.cost.low, c.cost.currency)} – {formatMoney(c.cost.high, c.cost.currency)} per unit
            <span className="ml-2 text-sm font-normal text-muted">at {formatCount(c.cost.annualVolume)} units/year</span>
          </p>
          <p className="text-sm">
            Power-stage BOM estimate {formatMoney(c.cost.bomCost, c.cost.currency)} per unit, with a contingency of −{c.cost.lowPct} % / +{c.cost.highPct} %.
          </p>
          <p className="text-sm font-medium" data-cost-notice>{COST_NOTICE}</p>
          <p className="text-xs text-muted">Included: {c.cost.covers.join(', ')}.</p>
        </Section>
      )}

      <Section title="Lead risks" id="risks">
        {c.risks.length === 0 ? <p className="text-sm text-muted">No risk is flagged for the recommended scheme.</p> : (
          <ul className="list-disc space-y-1 pl-5 text-sm">{c.risks.map((r) => <li key={r}>{r}</li>)}</ul>
        )}
      </Section>

      <Section title="Assumptions" id="assumptions">
        <ul className="list-disc space-y-1 pl-5 text-sm">{c.assumptions.map((a) => <li key={a}>{a}</li>)}</ul>
      </Section>

      <div className="brief-keep"><SafetyCautionText /></div>

      <footer className="border-t border-line pt-3 text-xs text-muted">
        Requirement set “{c.spec.name}”, version {c.spec.version} · engine {c.engineVersion} · parts library {c.partsLibrary.name} {c.partsLibrary.version}
        {c.demo && <span className="block" data-brief-demo>Demo workspace: the company, the customer and every figure in this brief are fictional.</span>}
      </footer>
    </article>
  );
}
