/** A broken workflow rule; `status` is the HTTP status the endpoint answers with. */
export class ShortlistRuleError extends Error {
  constructor(readonly status: 403 | 404 | 409 | 400, message: string) {
    super(message);
  }
}
