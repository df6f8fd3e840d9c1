// Typed errors thrown by services; one middleware turns them into { error: { code, message, issues? } }.

export interface ErrorIssue {
  path: (string | number)[];
  message: string;
  code?: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly extra: Record<string, unknown> = {},
    readonly issues?: ErrorIssue[],
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badInput = (message: string, issues?: ErrorIssue[], code = 'bad_input') => new AppError(400, code, message, {}, issues);
export const notSignedIn = (message = 'Please sign in.') => new AppError(401, 'not_signed_in', message);
export const forbidden = (message = 'Your role may not do this.') => new AppError(403, 'forbidden', message);
export const passwordChangeRequired = () =>
  new AppError(403, 'password_change_required', 'This account still has the default password. Choose a new password first.');
export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string, extra: Record<string, unknown> = {}) => new AppError(409, code, message, extra);
export const tooLarge = (message: string) => new AppError(413, 'too_large', message);
export const throttled = (message: string, retryAfterSeconds?: number) =>
  new AppError(429, 'throttled', message, retryAfterSeconds ? { retryAfterSeconds } : {});
