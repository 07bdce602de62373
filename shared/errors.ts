// The one error envelope every API answer uses, and every code in it: the server throws these,
// the app compares against these; neither side writes a code as a string of its own.
export type FieldErrors = Record<string, string[]>;

/** One rule of the release or return gate that did not hold (shared/rules/release.ts names them). */
export interface RuleFailure<Rule extends string = string> {
  rule: Rule;
  message: string;
}

export interface ErrorBody {
  error: {
    code: ErrorCode | string;
    message: string;
    fieldErrors?: FieldErrors;
    failures?: RuleFailure[];
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
  /** A value that names a row that does not exist (a foreign key the database refused). */
  unknownReference: 'UNKNOWN_REFERENCE',
  // Domain conflicts and refusals.
  bookingLocked: 'BOOKING_LOCKED',
  planChanged: 'PLAN_CHANGED',
  notAwaitingApproval: 'NOT_AWAITING_APPROVAL',
  releaseRefused: 'RELEASE_REFUSED',
  returnRefused: 'RETURN_REFUSED',
  itemTaken: 'ITEM_TAKEN',
  itemRetired: 'ITEM_RETIRED',
  itemNotInBooking: 'ITEM_NOT_IN_BOOKING',
  inspectionRequired: 'INSPECTION_REQUIRED',
  tagTaken: 'TAG_TAKEN',
  emailTaken: 'EMAIL_TAKEN',
  nothingToConfirm: 'NOTHING_TO_CONFIRM',
  benchLogClosed: 'BENCH_LOG_CLOSED',
  linkUsedOrInvalid: 'LINK_USED_OR_INVALID',
  linkExpired: 'LINK_EXPIRED',
  // Uploads.
  unsupportedFileType: 'UNSUPPORTED_FILE_TYPE',
  fileTooLarge: 'FILE_TOO_LARGE',
  uploadCapReached: 'UPLOAD_CAP_REACHED',
  // Physics input the calculators refuse (shared/hv/errors.ts).
  invalidInput: 'INVALID_INPUT',
} as const;

export type ErrorCode = (typeof ERROR_CODES)[keyof typeof ERROR_CODES];

export function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === 'object' && error !== null && typeof (error as { message?: unknown }).message === 'string';
}
