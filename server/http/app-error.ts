export interface ErrorIssue {
  path: (string | number)[];
  message: string;
  row?: number;
  column?: string;
}

export class AppError extends Error {
  constructor(
    readonly code: string,
    readonly status: number,
    message: string,
    readonly issues?: ErrorIssue[],
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError('not_found', 404, `${what} not found`);
export const forbidden = (message = 'Your role in this studio may not do that') => new AppError('forbidden', 403, message);
export const unauthenticated = () => new AppError('unauthenticated', 401, 'Sign in first');
