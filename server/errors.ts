// Typed errors carry their HTTP status and envelope code; the one error handler turns them into
// `{ error: { code, message, … } }`. Anything else becomes a plain 500 without a stack.
import { ERROR_CODES, type FieldErrors, type RuleFailure } from '../shared/errors';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: { fieldErrors?: FieldErrors; failures?: RuleFailure[] } = {},
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class ValidationError extends AppError {
  constructor(message: string, fieldErrors?: FieldErrors) {
    super(400, ERROR_CODES.validation, message, { fieldErrors });
  }
}

export class UnauthenticatedError extends AppError {
  constructor(message = 'Sign in to continue.') {
    super(401, ERROR_CODES.unauthenticated, message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super(403, ERROR_CODES.forbidden, message);
  }
}

export class NotFoundError extends AppError {
  constructor(message = 'Not found.') {
    super(404, ERROR_CODES.notFound, message);
  }
}

export class ConflictError extends AppError {
  constructor(message: string, code: string = ERROR_CODES.conflict, failures?: RuleFailure[]) {
    super(409, code, message, { failures });
  }
}

export class UnavailableError extends AppError {
  constructor(message = 'The database is unavailable. Try again in a moment.') {
    super(503, ERROR_CODES.unavailable, message);
  }
}
