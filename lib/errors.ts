/**
 * One error type for the whole product. `code` is `<kind>:<subject>` (e.g. `forbidden:target`,
 * `bad_request:import`); the kind alone decides the HTTP status, in `statusForCode`.
 */
export type ErrorKind =
  | "bad_request"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "rate_limited"
  | "unavailable"
  | "internal";

export type ErrorCode = `${ErrorKind}:${string}`;

/** Field name → messages, for forms and request bodies that failed validation. */
export type FieldErrors = Record<string, string[]>;

const statusByKind: Record<ErrorKind, number> = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
  }

  get kind(): ErrorKind {
    return this.code.split(":")[0] as ErrorKind;
  }
}

export function statusForCode(code: ErrorCode): number {
  return statusByKind[code.split(":")[0] as ErrorKind] ?? 500;
}

/** The JSON body of every error answer: `{ error: { code, message, fields? } }`. */
export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: FieldErrors; details?: Record<string, unknown> };
}

export function errorBody(error: AppError): ErrorBody {
  return {
    error: {
      code: error.code,
      message: error.message,
      ...(error.fields ? { fields: error.fields } : {}),
      ...(error.details ? { details: error.details } : {}),
    },
  };
}
