/** An expected (operational) failure with an HTTP status, a stable code and optional field messages. */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    /** Seconds the client should wait before trying again (sent as Retry-After; 429 and 503). */
    public readonly retryAfterS?: number,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static badRequest(message: string, fields?: Record<string, string>): AppError {
    return new AppError(400, 'validation_failed', message, fields);
  }
  static unauthorized(message = 'Sign in to continue'): AppError {
    return new AppError(401, 'unauthorized', message);
  }
  static forbidden(message = 'You are not allowed to do that'): AppError {
    return new AppError(403, 'forbidden', message);
  }
  static notFound(what = 'Resource'): AppError {
    return new AppError(404, 'not_found', `${what} not found`);
  }
  static conflict(code: string, message: string): AppError {
    return new AppError(409, code, message);
  }
}
