// Why a reference cannot be used, as the API names it (the reference row keeps code and message).
export class MatchError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
  }
}
