/** Expected failures, mapped to HTTP statuses at the edge (see lib/api/handler.ts). */
export class DomainError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly code: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class NotFound extends DomainError {
  constructor(message = "Not found") {
    super(message, 404, "not_found");
  }
}
export class Unauthorized extends DomainError {
  constructor(message = "Sign in to continue") {
    super(message, 401, "unauthorized");
  }
}
export class Forbidden extends DomainError {
  constructor(message = "You do not have permission to do this") {
    super(message, 403, "forbidden");
  }
}
export class Conflict extends DomainError {
  constructor(message: string) {
    super(message, 409, "conflict");
  }
}
export class Invalid extends DomainError {
  constructor(message: string, fieldErrors?: Record<string, string[]>) {
    super(message, 400, "invalid", fieldErrors);
  }
}
/** A limit of lib/api/rate-limit.ts was reached: 429 with Retry-After (RFC 6585 §4, RFC 9110 §10.2.3). */
export class TooManyRequests extends DomainError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(message, 429, "rate_limited");
  }
}
