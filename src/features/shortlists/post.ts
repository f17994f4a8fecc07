import { api } from '../../lib/api-client';

/** Calls a shortlist endpoint and reloads the page on success; returns the error text otherwise. */
export async function actThenReload(method: string, url: string, body: unknown = {}): Promise<string | null> {
  const result = await api(method, url, body);
  if (result.ok) {
    window.location.reload();
    return null;
  }
  const fields = result.problem.fields?.map((f) => f.message).join('; ');
  return fields ? `${result.problem.error} ${fields}` : result.problem.error;
}
