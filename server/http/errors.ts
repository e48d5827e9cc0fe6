import { errorCodes, type ErrorCode } from '../../shared/api/error';

/** A failure the client can act on; the error middleware turns it into the one error body. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | string,
    message: string,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class BadRequestError extends AppError {
  constructor(message: string, code: string = errorCodes.badRequest) {
    super(400, code, message);
  }
}
export class UnauthenticatedError extends AppError {
  constructor(message = 'Sign in first.') {
    super(401, errorCodes.unauthenticated, message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = 'Your role in this team does not allow that.') {
    super(403, errorCodes.forbidden, message);
  }
}
export class NotFoundError extends AppError {
  constructor(what = 'That') {
    super(404, errorCodes.notFound, `${what} was not found.`);
  }
}
export class ConflictError extends AppError {
  constructor(message: string, code: string = errorCodes.conflict) {
    super(409, code, message);
  }
}
export class TooLargeError extends AppError {
  constructor(message: string) {
    super(413, errorCodes.tooLarge, message);
  }
}
