import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { errorCodes, type ApiErrorBody } from '../../shared/api/error';
import { isDuplicateKey } from '../db/duplicate-key';
import { AppError, NotFoundError } from './errors';
import { sendVersion, VersionConflictError } from './versions';

function body(
  code: string,
  message: string,
  issues?: ApiErrorBody['error']['issues'],
): ApiErrorBody {
  return { error: issues ? { code, message, issues } : { code, message } };
}

/** Unknown /api routes answer 404 in the same shape as every other error. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`Route ${req.method} ${req.path}`));
};

/** The one error middleware, mounted last. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) {
    req.log?.error({ err }, 'error after headers were sent');
    res.destroy();
    return;
  }
  if (err instanceof ZodError) {
    const issues = err.issues.map((i) => ({
      path: i.path.map((p) => (typeof p === 'number' ? p : String(p))),
      message: i.message,
    }));
    const first = issues[0];
    const where = first && first.path.length > 0 ? `${first.path.join('.')}: ` : '';
    res
      .status(400)
      .json(
        body(
          errorCodes.badRequest,
          `Invalid input. ${where}${first?.message ?? ''}`.trim(),
          issues,
        ),
      );
    return;
  }
  if (err instanceof VersionConflictError) {
    const b = body(err.code, err.message);
    b.error.currentVersion = err.currentVersion;
    sendVersion(res, err.currentVersion).status(412).json(b);
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json(body(err.code, err.message));
    return;
  }
  if (isDuplicateKey(err)) {
    // Two requests raced to create the same thing; the other one won.
    res
      .status(409)
      .json(
        body(errorCodes.conflict, 'That was just created by another request. Reload and retry.'),
      );
    return;
  }
  // body-parser and friends mark client errors with a status (malformed JSON 400, too big 413).
  const status =
    typeof err === 'object' && err !== null ? (err as { status?: unknown }).status : undefined;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const code =
      status === 413
        ? errorCodes.tooLarge
        : status === 404
          ? errorCodes.notFound
          : errorCodes.badRequest;
    const message =
      status === 413
        ? 'The request body is too large.'
        : (err as { type?: string }).type === 'entity.parse.failed'
          ? 'The request body is not valid JSON.'
          : (err as { type?: string }).type === 'entity.too.deep'
            ? (err as Error).message
            : 'The request could not be read.';
    res.status(status).json(body(code, message));
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res
    .status(500)
    .json(body(errorCodes.internal, 'Something went wrong on the server. It has been logged.'));
};
