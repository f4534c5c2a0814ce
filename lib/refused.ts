// The one way anything in Quadrille says no: a refusal carries the HTTP status
// it means (404 not found or not yours, 409 conflict, 410 gone, 413 too large,
// 415 wrong type, 422 invalid) and a message for people; the route wrapper
// (lib/http/route.ts) turns it into the JSON error answer, and nothing is written.
export type RefusalStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 429;

export class Refused extends Error {
  constructor(
    public status: RefusalStatus,
    message: string,
    /** Field-level detail, e.g. zod issues: `[{ path, message, code? }]`. */
    public issues?: unknown,
  ) {
    super(message);
    this.name = 'Refused';
  }
}
