// The one error envelope every API answer uses, and the codes both sides rely on.
export type FieldErrors = Record<string, string[]>;

export interface ErrorBody {
  error: {
    code: ErrorCode | string;
    message: string;
    fieldErrors?: FieldErrors;
    failures?: { rule: string; message: string }[];
  };
}

export const ERROR_CODES = {
  validation: 'VALIDATION_FAILED',
  unauthenticated: 'UNAUTHENTICATED',
  forbidden: 'FORBIDDEN',
  csrf: 'CSRF_TOKEN_INVALID',
  invalidCredentials: 'INVALID_CREDENTIALS',
  rateLimited: 'RATE_LIMITED',
  notFound: 'NOT_FOUND',
  conflict: 'CONFLICT',
  unavailable: 'SERVICE_UNAVAILABLE',
  internal: 'INTERNAL',
} as const;

export type ErrorCode = (typeof ERROR_CODES)[keyof typeof ERROR_CODES];

export function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === 'object' && error !== null && typeof (error as { message?: unknown }).message === 'string';
}
