import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { ERROR_CODES, type ErrorBody } from '../../shared/errors';
import { HvInputError } from '../../shared/hv';
import { isDatabaseUnavailable } from '../db';
import { AppError, NotFoundError, UnavailableError } from '../errors';
import { requestContext } from './request-log';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`No API route for ${req.method} ${req.path}.`));
};

function bodyFor(error: AppError): ErrorBody {
  return { error: { code: error.code, message: error.message, ...error.details } };
}

/** The one place errors become responses. Stacks and SQL never leave the server. */
export const errorHandler =
  (logger: Logger): ErrorRequestHandler =>
  (err, req, res, _next) => {
    let error: AppError;
    if (err instanceof AppError) {
      error = err;
    } else if (err instanceof HvInputError) {
      // The physics refused its input (e.g. a safe voltage above the starting voltage).
      error = new AppError(400, ERROR_CODES.validation, err.message, { fieldErrors: { [err.field]: [err.message] } });
    } else if (isDatabaseUnavailable(err)) {
      error = new UnavailableError();
    } else if (err?.type === 'entity.parse.failed') {
      error = new AppError(400, ERROR_CODES.validation, 'The request body is not valid JSON.');
    } else if (err?.type === 'entity.too.large') {
      error = new AppError(413, ERROR_CODES.validation, 'The request body is too large.');
    } else if (typeof err?.status === 'number' && err.status >= 400 && err.status < 500) {
      // Errors from libraries (csrf-sync, multer, body parsing) that already chose a 4xx.
      const code = err.code === ERROR_CODES.csrf ? ERROR_CODES.csrf : err.status === 403 ? ERROR_CODES.forbidden : ERROR_CODES.validation;
      error = new AppError(err.status, code, String(err.message ?? 'Bad request.'));
    } else {
      error = new AppError(500, ERROR_CODES.internal, 'Something went wrong on the server. It has been logged.');
    }
    if (error.status >= 500 && error.status !== 503) logger.error({ err, ...requestContext(req) }, 'server error');
    if (res.headersSent) return;
    res.status(error.status).json(bodyFor(error));
  };
