import { evaluate, type Comparison, type PartsLibrary } from '../../engine';
import { SCHEME_IDS, type SchemeId } from '../../engine/scheme-ids';
import type { Db } from '../../db/client';
import { getBrief, getShortlistForBrief, listVersions, type BriefRow, type DecidedShortlist, type VersionWithShares } from '../../db/queries/briefs';
import { getSpec, type SpecDetail } from '../../db/queries/specs';
import { users } from '../../db/schema';
import { eq } from 'drizzle-orm';
import { briefDraftSchema, type BriefDraft } from '../../schemas/briefs';
import { DEMO_COMPANY } from '../../demo/accounts';
import { currentLibrary } from '../parts/library.server';
import { composeBrief } from './compose';
import type { BriefContent } from '../../schemas/brief-content';

const isScheme = (v: string | null): v is SchemeId => v !== null && (SCHEME_IDS as readonly string[]).includes(v);

/** A shortlist counts only once decided on a candidate of a known scheme. */
export function decidedScheme(shortlist: DecidedShortlist | undefined): SchemeId | null {
  return shortlist && shortlist.status === 'decided' && isScheme(shortlist.decidedScheme) ? shortlist.decidedScheme : null;
}

/**
 * The comparison behind a brief: the saved requirement set through the engine and the team's
 * current parts library (prices at its volume tiers), with the
 * decided candidate's options applied to its scheme when a decided shortlist backs the brief.
 */
export function comparisonForBrief(spec: SpecDetail, shortlist: DecidedShortlist | undefined, library: PartsLibrary): Comparison {
  const scheme = decidedScheme(shortlist);
  const options = shortlist?.decidedOverrides;
  if (scheme && options && Object.keys(options).length > 0) {
    try {
      const overrides = { ...((spec.requirements.overrides as Record<string, unknown> | undefined) ?? {}), [scheme]: options };
      return evaluate({ ...spec.requirements, overrides }, library);
    } catch {
      // options the engine no longer accepts: fall back to the plain requirement set
    }
  }
  return evaluate(spec.requirements, library);
}

/** The stored draft, read leniently: fields that no longer validate fall back to defaults. */
export function readDraft(raw: Record<string, unknown>): BriefDraft {
  const parsed = briefDraftSchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const fallback = briefDraftSchema.parse({});
  for (const key of Object.keys(fallback) as (keyof BriefDraft)[]) {
    const one = briefDraftSchema.pick({ [key]: true } as Record<keyof BriefDraft, true>).safeParse({ [key]: raw[key] });
    if (one.success) Object.assign(fallback, one.data);
  }
  return fallback;
}

export interface LoadedBrief {
  brief: BriefRow;
  spec: SpecDetail;
  draft: BriefDraft;
  comparison: Comparison;
  content: BriefContent;
  versions: VersionWithShares[];
}

/** Everything the editor and the API show for one brief; the preview is computed now. */
export async function loadBrief(db: Db, id: string, options: { demo: boolean }): Promise<LoadedBrief | undefined> {
  const brief = await getBrief(db, id);
  if (!brief) return undefined;
  const spec = await getSpec(db, brief.specId);
  if (!spec) return undefined;
  const shortlist = brief.shortlistId ? await getShortlistForBrief(db, brief.shortlistId) : undefined;
  const [author] = await db.select({ name: users.displayName, email: users.email }).from(users).where(eq(users.id, brief.createdById)).limit(1);
  const draft = readDraft(brief.draft);
  const comparison = comparisonForBrief(spec, shortlist, (await currentLibrary(db)).library);
  const content = composeBrief(comparison, draft, {
    title: brief.title,
    customerName: brief.customerName,
    customerContact: brief.customerContact,
    preparedBy: { name: author?.name ?? brief.createdByName, email: author?.email ?? '', company: options.demo ? DEMO_COMPANY : null },
    spec: { id: spec.id, name: spec.name, version: spec.version },
    demo: options.demo,
    shortlist: shortlist ? { id: shortlist.id, title: shortlist.title, decidedScheme: decidedScheme(shortlist), rationale: shortlist.status === 'decided' ? shortlist.rationale : null } : null,
  });
  return { brief, spec, draft, comparison, content, versions: await listVersions(db, id) };
}

/** JSON with object keys sorted at every level (jsonb does not keep key order). */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** Two contents say the same thing, whatever order the database returned their keys in. */
export function sameContent(a: BriefContent, b: BriefContent): boolean {
  return canonical(a) === canonical(b);
}
