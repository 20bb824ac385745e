/**
 * Errors the domain and data-access layers throw; the route wrapper maps them to status codes
 * in one place. Messages are written for the user: the UI shows them as they are.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export class BadRequestError extends AppError {
  constructor(message: string, issues?: unknown) {
    super(400, message, issues === undefined ? {} : { issues });
  }
}
export class UnauthorizedError extends AppError {
  constructor(message = "Sign in to continue.") {
    super(401, message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = "Your role in this team does not allow that.") {
    super(403, message);
  }
}
export class NotFoundError extends AppError {
  constructor(what = "That item") {
    super(404, `${what} was not found.`);
  }
}
export class ConflictError extends AppError {
  constructor(message: string, extra: Record<string, unknown> = {}) {
    super(409, message, extra);
  }
}
export class PayloadTooLargeError extends AppError {
  constructor(message: string) {
    super(413, message);
  }
}
/** 423 Locked (RFC 4918 §11.3): the die's markup is fixed while checked or signed off. */
export class LockedError extends AppError {
  constructor(message: string, extra: Record<string, unknown> = {}) {
    super(423, message, extra);
  }
}
