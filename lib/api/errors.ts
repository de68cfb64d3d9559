import { ZodError } from 'zod';
import { describeError } from '@/lib/log';

// Typed errors thrown anywhere on the server; one mapper turns them into HTTP answers.
export class AppError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: FieldError[],
  ) {
    super(message);
  }
}
export interface FieldError {
  field: string;
  message: string;
}
export class Unauthenticated extends AppError {
  constructor(message = 'Sign in to continue.') {
    super(401, 'unauthenticated', message);
  }
}
export class Forbidden extends AppError {
  constructor(message = 'Your role may not do this.') {
    super(403, 'forbidden', message);
  }
}
export class NotFound extends AppError {
  constructor(what = 'Record') {
    super(404, 'not_found', `${what} not found.`);
  }
}
export class Conflict extends AppError {
  constructor(message: string) {
    super(409, 'conflict', message);
  }
}
export class Invalid extends AppError {
  constructor(fields: FieldError[], message = 'Some fields need attention.') {
    super(422, 'validation', message, fields);
  }
}
export class TooLarge extends AppError {
  constructor(message = 'The request body is too large.') {
    super(413, 'too_large', message);
  }
}

export class UnsupportedMediaType extends AppError {
  constructor(message = 'Send the body as JSON with Content-Type: application/json.') {
    super(415, 'unsupported_media_type', message);
  }
}

export class TooManyRequests extends AppError {
  constructor(public retryAfterSeconds: number, message = 'Too many attempts from this address. Wait a while, then try again.') {
    super(429, 'too_many_requests', message);
  }
}

/** Field errors from a zod error: the path joined with dots ("engine.nodes.0.lossWPerK"). */
export function zodFields(err: ZodError): FieldError[] {
  return err.issues.map((i) => ({ field: i.path.map(String).join('.') || '(body)', message: i.message }));
}

export interface ErrorBody {
  error: string;
  message: string;
  fields?: FieldError[];
}

/** Maps any thrown value to a status and a body; unknown errors are logged and answered as 500 with no detail. */
export function toErrorResponse(err: unknown): { status: number; body: ErrorBody } {
  if (err instanceof ZodError) {
    return { status: 422, body: { error: 'validation', message: 'Some fields need attention.', fields: zodFields(err) } };
  }
  if (err instanceof AppError) {
    return { status: err.status, body: { error: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } };
  }
  const name = (err as { name?: string } | null)?.name ?? '';
  if (name === 'SequelizeUniqueConstraintError') {
    return { status: 409, body: { error: 'conflict', message: 'A record with these values already exists.' } };
  }
  // Name and driver code only: a database error carries the statement and its values.
  console.error(`[thawline] unhandled error: ${describeError(err)}`);
  return { status: 500, body: { error: 'internal', message: 'Something went wrong on our side. Try again in a moment.' } };
}
