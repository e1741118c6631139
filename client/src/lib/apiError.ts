import type { ApiErrorBody, ErrorDetail } from '@stormhour/shared';

/** Messages for failures whose body carries no readable message of its own. */
const FALLBACK_MESSAGES: Record<number, string> = {
  0: 'The server could not be reached. Check the connection and try again.',
  401: 'Your session has ended. Please sign in again.',
  403: 'You do not have permission to do this.',
  404: 'This was not found.',
  413: 'The file is too large for the server to accept.',
  429: 'Too many attempts. Wait a minute and try again.',
};

/** An API failure as the forms show it: one message, plus what went wrong where. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details: ErrorDetail[] = [],
    readonly requestId?: string,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  /** Problems keyed by the field they name, for field-level form errors. */
  get fieldErrors(): Record<string, string> {
    return fieldErrorsFromDetails(this.details);
  }
}

export function fieldErrorsFromDetails(details: readonly ErrorDetail[]): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const { where, problem } of details) {
    // A field can have several problems; the first is the one to fix first.
    errors[where] ??= problem;
  }
  return errors;
}

function isErrorBody(value: unknown): value is Partial<ApiErrorBody> {
  return typeof value === 'object' && value !== null;
}

/** Builds an ApiError from a status and the raw response text, whatever shape the text has. */
export function apiErrorFrom(status: number, text: string): ApiError {
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    // A proxy's HTML error page or plain text: fall back to the status message below.
  }
  const fallback = FALLBACK_MESSAGES[status] ?? `The server answered with an error (${status}).`;
  if (!isErrorBody(body)) return new ApiError(status, fallback);
  const raw = body.message as unknown;
  const message = Array.isArray(raw) ? raw.join('; ') : typeof raw === 'string' && raw ? raw : fallback;
  const details = Array.isArray(body.details) ? body.details.filter(isDetail) : [];
  return new ApiError(status, message, details, body.requestId);
}

function isDetail(value: unknown): value is ErrorDetail {
  return (
    isErrorBody(value) &&
    typeof (value as ErrorDetail).where === 'string' &&
    typeof (value as ErrorDetail).problem === 'string'
  );
}

export function networkError(): ApiError {
  return new ApiError(0, FALLBACK_MESSAGES[0]);
}

/** A readable message for anything a query or mutation may throw. */
export function messageOf(error: unknown): string {
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}
