// The one error shape every failing API call answers with:
//   { "error": { "code": "snake_case", "message": "human sentence", "details": … } }

export type ErrorCode =
  | 'validation_failed'
  | 'malformed_json'
  | 'unauthenticated'
  | 'invalid_credentials'
  | 'account_disabled'
  | 'csrf_invalid'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'last_supervisor'
  | 'already_member'
  | 'email_taken'
  | 'invalid_token'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'unprocessable'
  | 'rate_limited'
  | 'db_unavailable'
  | 'internal_error'
  | (string & {});

export interface ApiErrorBody {
  error: { code: ErrorCode; message: string; details?: unknown };
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === 'object' && error !== null && 'code' in error && 'message' in error;
}
