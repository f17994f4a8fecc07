/** Client-side calls to /api/v1 for the Compare islands; every failure becomes a plain message. */
export interface ApiProblem {
  status: number;
  error: string;
  fields?: { field: string; message: string }[];
  currentVersion?: number;
}

export type ApiResult<T> = { ok: true; data: T } | { ok: false; problem: ApiProblem };

export async function api<T>(method: string, url: string, body?: unknown): Promise<ApiResult<T>> {
  try {
    const response = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const data = (await response.json().catch(() => ({}))) as Record<string, unknown>;
    if (response.ok) return { ok: true, data: data as T };
    return {
      ok: false,
      problem: {
        status: response.status,
        error: typeof data.error === 'string' ? data.error : `The server answered ${response.status}.`,
        ...(Array.isArray(data.fields) ? { fields: data.fields as ApiProblem['fields'] } : {}),
        ...(typeof data.currentVersion === 'number' ? { currentVersion: data.currentVersion } : {}),
      },
    };
  } catch {
    return { ok: false, problem: { status: 0, error: 'The server could not be reached. Check the connection and try again.' } };
  }
}

export interface SpecPayload {
  id: string;
  name: string;
  customer: string;
  version: number;
  requirements: Record<string, unknown>;
  updatedAt: string;
  updatedBy: string | null;
}
