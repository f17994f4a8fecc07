import { VERDICT_LABELS } from '../../lib/verdict';
import type { BriefContent } from '../../schemas/brief-content';
import { formatCount, formatMoney } from '../../lib/format';
import { ESTIMATE_NOTICE, SAFETY_TEXT } from './notices';

export interface BriefMailInput {
  content: BriefContent;
  version: number;
  link: string;
  expiresAt: Date;
  message?: string | undefined;
  senderName: string;
}

const escape = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
const day = (d: Date): string => d.toISOString().slice(0, 10);

/** Subject, plain-text and HTML parts of a brief e-mail; both parts carry the share link. */
export function briefMail(input: BriefMailInput): { subject: string; text: string; html: string } {
  const c = input.content;
  const subject = `${c.title} (version ${input.version})`;
  const cost = c.cost && c.recommended
    ? `Indicative power-stage BOM for the ${c.recommended.label} scheme: ${formatMoney(c.cost.low, c.cost.currency)} to ${formatMoney(c.cost.high, c.cost.currency)} per unit at ${formatCount(c.cost.annualVolume)} units/year (power-stage parts only, not a quote).`
    : 'No scheme is feasible as the requirements stand, so no cost is given.';
  const verdictLines = c.verdicts.map((v) => `- ${v.label}: ${VERDICT_LABELS[v.verdict]}`);
  const text = [
    ...(input.message ? [input.message, ''] : []),
    `${c.title}`,
    `For ${c.customerName}${c.customerContact ? ` (${c.customerContact})` : ''}`,
    '',
    c.summary,
    '',
    'Verdict per core-reset scheme:',
    ...verdictLines,
    '',
    cost,
    '',
    `Read the full brief (version ${input.version}) here: ${input.link}`,
    `The link works until ${day(input.expiresAt)} and shows this version only.`,
    '',
    ESTIMATE_NOTICE,
    SAFETY_TEXT,
    ...(c.demo ? ['', 'Demo workspace: the company, customer and every figure in this brief are fictional.'] : []),
    '',
    `${input.senderName}${c.preparedBy.company ? `, ${c.preparedBy.company}` : ''}`,
  ].join('\n');

  const p = (s: string, style = ''): string => `<p style="margin:0 0 12px;${style}">${escape(s)}</p>`;
  const html = [
    '<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;font-size:14px;line-height:1.45;color:#1e2622;max-width:640px">',
    ...(input.message ? [`<div style="margin:0 0 16px;white-space:pre-wrap">${escape(input.message)}</div>`] : []),
    `<h1 style="font-size:18px;margin:0 0 4px">${escape(c.title)}</h1>`,
    p(`For ${c.customerName}${c.customerContact ? ` (${c.customerContact})` : ''}`, 'color:#5c6761'),
    p(c.summary),
    '<table style="border-collapse:collapse;margin:0 0 12px" cellpadding="4">',
    '<tr><th align="left" style="border-bottom:1px solid #d9ddd8">Core-reset scheme</th><th align="left" style="border-bottom:1px solid #d9ddd8">Verdict</th></tr>',
    ...c.verdicts.map((v) => `<tr><td>${escape(v.label)}</td><td>${escape(VERDICT_LABELS[v.verdict])}</td></tr>`),
    '</table>',
    p(cost),
    `<p style="margin:0 0 12px"><a href="${escape(input.link)}" style="color:#0b6e6e;font-weight:bold">Read the full brief (version ${input.version})</a><br><span style="color:#5c6761">${escape(input.link)}</span><br><span style="color:#5c6761">The link works until ${day(input.expiresAt)} and shows this version only.</span></p>`,
    p(ESTIMATE_NOTICE, 'font-weight:bold'),
    p(SAFETY_TEXT, 'padding:8px;background:#fff4e0;border:1px solid #e8c88f'),
    ...(c.demo ? [p('Demo workspace: the company, customer and every figure in this brief are fictional.', 'color:#5c6761;font-size:12px')] : []),
    p(`${input.senderName}${c.preparedBy.company ? `, ${c.preparedBy.company}` : ''}`),
    '</body></html>',
  ].join('\n');
  return { subject, text, html };
}
