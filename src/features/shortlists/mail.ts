import type { OutgoingMail } from '../../lib/server/mail';

export interface VotingMailFacts {
  shortlistId: string;
  title: string;
  specName: string;
  ownerName: string;
  deadline: Date;
  candidates: string[];
  link: string;
}

const escapeHtml = (text: string): string => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const when = (d: Date): string => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function votingMail(kind: 'voting-opened' | 'voting-reminder', to: string, facts: VotingMailFacts): OutgoingMail {
  const opening = kind === 'voting-opened'
    ? `${facts.ownerName} has opened voting on the shortlist "${facts.title}" for ${facts.specName}.`
    : `Voting on the shortlist "${facts.title}" for ${facts.specName} closes within a day and you have not voted yet.`;
  const lines = [
    opening,
    '',
    `Candidates: ${facts.candidates.join(', ')}.`,
    `Deadline: ${when(facts.deadline)}.`,
    '',
    'Rank every candidate and raise a blocking concern where you have one:',
    facts.link,
    '',
    'Results stay hidden until you have voted.',
    '— Resetwise',
  ];
  const html = `<p>${escapeHtml(opening)}</p><p>Candidates: ${escapeHtml(facts.candidates.join(', '))}.<br>Deadline: <strong>${escapeHtml(when(facts.deadline))}</strong>.</p><p><a href="${escapeHtml(facts.link)}">Rank the candidates</a> and raise a blocking concern where you have one.</p><p>Results stay hidden until you have voted.</p><p>— Resetwise</p>`;
  return {
    kind,
    to: [to],
    subject: kind === 'voting-opened' ? `Vote: ${facts.title}` : `Reminder — vote by ${when(facts.deadline)}: ${facts.title}`,
    text: lines.join('\n'),
    html,
    related: { type: 'shortlist', id: facts.shortlistId },
  };
}

export const votingOpenedMail = (to: string, facts: VotingMailFacts): OutgoingMail => votingMail('voting-opened', to, facts);
export const votingReminderMail = (to: string, facts: VotingMailFacts): OutgoingMail => votingMail('voting-reminder', to, facts);
