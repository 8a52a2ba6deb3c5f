/** The one error type services throw; the error middleware turns it into `{ error: { code, message, fields? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Extra members of the error object a client can act on (e.g. the id of the run that is already active). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }

  static badRequest(message: string, fields?: Record<string, string>) {
    return new AppError(400, 'bad_request', message, fields);
  }
  static unauthorized(message = 'Please sign in.') {
    return new AppError(401, 'unauthorized', message);
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'forbidden', message);
  }
  /** Also used for records of another clinic, so their existence is never revealed. */
  static notFound(what = 'Record') {
    return new AppError(404, 'not_found', `${what} not found.`);
  }
  static conflict(message: string, code = 'conflict', extra?: Record<string, unknown>) {
    return new AppError(409, code, message, undefined, extra);
  }
}
