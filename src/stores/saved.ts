import { atom, computed } from 'nanostores';
import { api, type SpecPayload } from '../lib/api-client';
import { $draftFields, $draftMeta, loadDraft } from './spec-draft';
import { $evaluation } from './evaluation';
import { $weights, loadWeights } from './weights';
import { $overrides, loadOverrides } from './overrides';
import { withSweepHandoff } from './sweep-handoff';

export type SaveStatus = 'idle' | 'saving' | 'saved' | 'conflict' | 'error';

export interface SavedState {
  specId: string | null;
  version: number;
  /** The form as last loaded or saved, to tell saved from unsaved. */
  snapshot: string;
  status: SaveStatus;
  message: string;
  /** Version someone else saved meanwhile (on conflict). */
  theirVersion: number | null;
}

export const $saved = atom<SavedState>({ specId: null, version: 0, snapshot: '', status: 'idle', message: '', theirVersion: null });

const snapshotNow = (): string => JSON.stringify([$draftFields.get(), $draftMeta.get(), $weights.get(), $overrides.get()]);

/** True when the form (fields, name, weights, overrides) differs from what was last loaded or saved. */
export const $dirty = computed([$draftFields, $draftMeta, $weights, $overrides, $saved], (fields, meta, weights, overrides, saved) => JSON.stringify([fields, meta, weights, overrides]) !== saved.snapshot);

function applyRequirements(spec: SpecPayload | null, requirements: Record<string, unknown>): void {
  const { weights, overrides, ...rest } = requirements as Record<string, unknown> & { weights?: never; overrides?: never };
  loadDraft(rest, { name: spec?.name ?? '', customer: spec?.customer ?? '' });
  loadWeights(weights);
  loadOverrides(overrides);
}

/**
 * Loads a saved requirement set into every store. A design point handed over from Sweep is
 * applied on top afterwards, so it shows as unsaved changes that can be saved or discarded.
 */
export function loadSpec(spec: SpecPayload | null, requirements: Record<string, unknown>): void {
  applyRequirements(spec, requirements);
  $saved.set({ specId: spec?.id ?? null, version: spec?.version ?? 0, snapshot: snapshotNow(), status: 'idle', message: '', theirVersion: null });
  const handed = withSweepHandoff(requirements);
  if (handed !== requirements) applyRequirements(spec, handed);
}

/**
 * Saves the form as the next version. With `overwrite`, saves over the version someone else
 * saved meanwhile (the user chose to); otherwise a newer version on the server is a conflict.
 */
export async function saveSpec(overwrite = false): Promise<void> {
  const state = $saved.get();
  const requirements = $evaluation.get().requirements;
  if (!state.specId) return;
  if (!requirements) {
    $saved.set({ ...state, status: 'error', message: 'Fix the marked fields before saving.' });
    return;
  }
  const version = overwrite && state.theirVersion ? state.theirVersion : state.version;
  const snapshot = snapshotNow();
  $saved.set({ ...state, status: 'saving', message: '' });
  const result = await api<SpecPayload>('PUT', `/api/v1/specs/${encodeURIComponent(state.specId)}`, { version, ...$draftMeta.get(), requirements });
  if (result.ok) {
    $saved.set({ specId: state.specId, version: result.data.version, snapshot, status: 'saved', message: `Saved as version ${result.data.version}.`, theirVersion: null });
  } else if (result.problem.status === 409) {
    $saved.set({ ...state, status: 'conflict', message: result.problem.error, theirVersion: result.problem.currentVersion ?? null });
  } else {
    const detail = result.problem.fields?.map((f) => f.message).join('; ');
    $saved.set({ ...state, status: 'error', message: detail ? `${result.problem.error} ${detail}` : result.problem.error });
  }
}

/** Replaces the form with the newest saved version from the server. */
export async function reloadSpec(): Promise<void> {
  const state = $saved.get();
  if (!state.specId) return;
  const result = await api<SpecPayload>('GET', `/api/v1/specs/${encodeURIComponent(state.specId)}`);
  if (!result.ok) {
    $saved.set({ ...state, status: 'error', message: result.problem.error });
    return;
  }
  loadSpec(result.data, result.data.requirements);
  $saved.set({ ...$saved.get(), status: 'saved', message: `Loaded version ${result.data.version}.` });
}

/** Saves a scratch comparison as a new requirement set and opens it. */
export async function createSpecFromDraft(): Promise<void> {
  const state = $saved.get();
  const requirements = $evaluation.get().requirements;
  if (!requirements) {
    $saved.set({ ...state, status: 'error', message: 'Fix the marked fields before saving.' });
    return;
  }
  $saved.set({ ...state, status: 'saving', message: '' });
  const result = await api<SpecPayload>('POST', '/api/v1/specs', { ...$draftMeta.get(), requirements });
  if (!result.ok) {
    const detail = result.problem.fields?.map((f) => f.message).join('; ');
    $saved.set({ ...state, status: 'error', message: detail ? `${result.problem.error} ${detail}` : result.problem.error });
    return;
  }
  $saved.set({ ...state, snapshot: snapshotNow(), status: 'saved', message: 'Created.' });
  window.location.assign(`/compare/${encodeURIComponent(result.data.id)}`);
}
