/**
 * An error the API reports to its caller: an HTTP status, a stable code and a plain message;
 * `extra` adds named values to the error body (e.g. the current state on a 409).
 */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export class NotFoundError extends AppError {
  constructor(code = 'NOT_FOUND', message = 'Not found.') {
    super(404, code, message);
  }
}

export class ValidationError extends AppError {
  constructor(fields: Record<string, string>, message = 'Some fields need attention.') {
    super(400, 'VALIDATION_FAILED', message, fields);
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = 'Please sign in first.') {
    super(401, 'SIGNED_OUT', message);
  }
}

export class ForbiddenError extends AppError {
  constructor(code = 'FORBIDDEN', message = 'You are not allowed to do that.') {
    super(403, code, message);
  }
}

export class ConflictError extends AppError {
  constructor(code: string, message: string, fields?: Record<string, string>) {
    super(409, code, message, fields);
  }
}

export class TooManyRequestsError extends AppError {
  constructor(
    public readonly retryAfterSeconds: number,
    message = 'Too many attempts. Please wait a little and try again.',
  ) {
    super(429, 'RATE_LIMITED', message);
  }
}

export class ServiceUnavailableError extends AppError {
  constructor(message = 'The database is not reachable right now. Please try again in a moment.') {
    super(503, 'DB_UNAVAILABLE', message);
  }
}
