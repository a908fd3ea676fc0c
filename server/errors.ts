/** The one error class services and middleware throw; the error handler turns it into the API's error shape. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: Record<string, string[]>,
  ) {
    super(message);
  }

  static badRequest(message: string, details?: Record<string, string[]>) {
    return new AppError(400, 'bad_request', message, details);
  }
  static unauthenticated(message = 'Sign in to continue.') {
    return new AppError(401, 'unauthenticated', message);
  }
  static forbidden(message: string) {
    return new AppError(403, 'forbidden', message);
  }
  static notFound(message: string) {
    return new AppError(404, 'not_found', message);
  }
  static conflict(message: string) {
    return new AppError(409, 'conflict', message);
  }
}
