import { z } from 'zod';
import { SCHEME_IDS } from '../engine/scheme-ids';
import { schemeOverrideSchema } from './spec';

const strict = (what: string) => ({
  error: (issue: { code?: string; keys?: string[] }) =>
    issue.code === 'unrecognized_keys' ? `unknown field(s): ${(issue.keys ?? []).join(', ')}` : `send ${what}`,
});
const id = (name: string) => z.string({ error: `${name} is required and must be text` }).min(1, { error: `${name} is required` }).max(100, { error: `${name} is too long` });

export const shortlistCreateSchema = z.strictObject(
  {
    specId: id('specId'),
    title: z.string({ error: 'title is required and must be text' }).trim().min(1, { error: 'title is required' }).max(160, { error: 'title must have at most 160 characters' }),
  },
  strict('an object with specId and title'),
);

export const candidateCreateSchema = z.strictObject(
  {
    scheme: z.enum(SCHEME_IDS, { error: `scheme must be one of ${SCHEME_IDS.join(', ')}` }),
    overrides: schemeOverrideSchema.optional(),
    note: z.string({ error: 'note must be text' }).trim().max(2000, { error: 'note must have at most 2000 characters' }).default(''),
  },
  strict('an object with scheme, overrides and note'),
);

export const openVotingSchema = z.strictObject(
  {
    deadline: z.iso.datetime({ offset: true, error: 'deadline must be a date and time such as 2026-12-24T17:00:00Z' }),
    voterIds: z.array(id('voterIds[]'), { error: 'voterIds must be a list of member ids' }).min(1, { error: 'invite at least one voter' }).max(1000, { error: 'at most 1000 voters' }),
  },
  strict('an object with deadline and voterIds'),
);

export const ballotSchema = z
  .strictObject(
    {
      ranking: z.array(id('ranking[]'), { error: 'ranking must be a list of candidate ids' }).min(1, { error: 'ranking must name every candidate' }).max(50),
      concerns: z
        .array(
          z.strictObject(
            {
              candidateId: id('concerns[].candidateId'),
              reason: z.string({ error: 'a blocking concern needs a reason' }).trim().min(3, { error: 'a blocking concern needs a reason (at least 3 characters)' }).max(2000),
            },
            strict('each concern as {candidateId, reason}'),
          ),
        )
        .max(50)
        .default([]),
      comment: z.string({ error: 'comment must be text' }).trim().max(4000, { error: 'comment must have at most 4000 characters' }).default(''),
    },
    strict('an object with ranking, concerns and comment'),
  )
  .refine((b) => new Set(b.ranking).size === b.ranking.length, { error: 'ranking must name each candidate only once', path: ['ranking'] })
  .refine((b) => new Set(b.concerns.map((c) => c.candidateId)).size === b.concerns.length, { error: 'one concern per candidate', path: ['concerns'] });
export type BallotInput = z.output<typeof ballotSchema>;

export const decisionSchema = z.strictObject(
  {
    candidateId: id('candidateId'),
    rationale: z.string({ error: 'rationale is required and must be text' }).trim().min(10, { error: 'rationale must explain the choice (at least 10 characters)' }).max(4000),
  },
  strict('an object with candidateId and rationale'),
);

export const emptyBodySchema = z.strictObject({}, strict('an empty JSON object {}'));

export const shortlistListQuerySchema = z.strictObject({ specId: id('specId').optional() }, strict('only specId as a query parameter'));
