import type { IncomingMessage, ServerResponse } from 'node:http';

export type Admission = {
  admit(req: IncomingMessage, res: ServerResponse, handle: (req: IncomingMessage, res: ServerResponse) => unknown): void;
  readonly active: number;
  readonly pending: number;
};

export function admission(opts: {
  concurrent: number;
  waiting: number;
  perClient?: number;
  retryAfterS?: number;
  what: string;
  keyOf?: (req: IncomingMessage) => string;
  /** How long a let-in request's body may take to arrive before 408 (10 s). */
  bodyMs?: number;
}): Admission;

export function clientOf(req: Pick<IncomingMessage, 'headers' | 'socket'>, trustedHops: number): string;

export function isCredentialForm(req: Pick<IncomingMessage, 'method' | 'url'>): boolean;
