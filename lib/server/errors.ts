/** Typed failures of the data-access layer; route handlers map them to HTTP statuses. */
export class AppError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = "Sign in to continue.") {
    super(message, 401);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = "You are not allowed to do this.") {
    super(message, 403);
  }
}

export class NotFoundError extends AppError {
  constructor(message = "Not found.") {
    super(message, 404);
  }
}

export class ConflictError extends AppError {
  constructor(message: string) {
    super(message, 409);
  }
}

export class InputError extends AppError {
  constructor(message: string, fieldErrors?: Record<string, string[]>) {
    super(message, 400, fieldErrors);
  }
}

export class TooManyError extends AppError {
  constructor(message: string) {
    super(message, 429);
  }
}
