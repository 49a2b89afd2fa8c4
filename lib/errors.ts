// Typed errors that route handlers and actions turn into answers. Database and library
// messages never reach a client: anything that is not an AppError becomes a plain 500.
export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const unauthorized = () => new AppError(401, "unauthorized", "Please sign in.");
export const forbidden = (why = "You do not have access to this.") => new AppError(403, "forbidden", why);
export const notFound = (what = "That item") => new AppError(404, "not_found", `${what} was not found.`);
export const conflict = (why: string) => new AppError(409, "conflict", why);
export const tooManyRequests = (why: string) => new AppError(429, "too_many_attempts", why);
export const invalid = (fieldErrors: FieldErrors, message = "Some fields need attention.") =>
  new AppError(400, "invalid", message, fieldErrors);

export function isAppError(error: unknown): error is AppError {
  return error instanceof AppError;
}
