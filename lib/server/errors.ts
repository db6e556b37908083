import 'server-only';
import { ZodError } from 'zod';

/** An error whose message is safe to show; `status` is the HTTP status it maps to. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'You do not have access to this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'record') => new AppError(404, 'not_found', `No such ${what}.`);
export const conflict = (message: string) => new AppError(409, 'conflict', message);
export const invalid = (message: string, fieldErrors?: Record<string, string[]>) => new AppError(422, 'invalid', message, fieldErrors);
export const tooLarge = (message: string) => new AppError(413, 'too_large', message);
export const unsupportedType = (message: string) => new AppError(415, 'unsupported_type', message);
export const rateLimited = (message: string) => new AppError(429, 'rate_limited', message);

/** Field errors keyed by dotted path, from a zod error. */
export function zodFieldErrors(error: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** The one place errors become HTTP responses; anything unexpected is logged and hidden. */
export function toHttpResponse(error: unknown): Response {
  if (error instanceof ZodError) {
    const fieldErrors = zodFieldErrors(error);
    const first = error.issues[0];
    const where = first?.path.length ? `${first.path.join('.')}: ` : '';
    return Response.json({ error: { code: 'invalid', message: `${where}${first?.message ?? 'Invalid input.'}`, fieldErrors } }, { status: 422 });
  }
  if (error instanceof AppError) {
    return Response.json({ error: { code: error.code, message: error.message, fieldErrors: error.fieldErrors } }, { status: error.status });
  }
  console.error('[fallbook] unexpected error', error);
  return Response.json({ error: { code: 'server_error', message: 'Something went wrong on the server.' } }, { status: 500 });
}
