// The one way anything in Quadrille says no: a refusal carries the HTTP status
// it means (404 not found or not yours, 409 conflict, 410 gone, 413 too large,
// 415 wrong type, 422 invalid, 503 busy: try again) and a message for people; the route wrapper
// (lib/http/route.ts) turns it into the JSON error answer, and nothing is written.
export type RefusalStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 429 | 503;

export class Refused extends Error {
  constructor(
    public status: RefusalStatus,
    message: string,
    /** Field-level detail, e.g. zod issues: `[{ path, message, code? }]`. */
    public issues?: unknown,
    /** Headers for the answer, e.g. Retry-After. */
    public headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'Refused';
  }
}
