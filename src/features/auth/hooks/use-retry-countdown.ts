import { useEffect, useState } from 'react';
import { isApiError } from '../../../lib/api-client';

/** Seconds the server asked us to wait (429 rate_limited, details.retryAfterSeconds), or null. */
export function retryAfterSeconds(error: unknown): number | null {
  if (!isApiError(error) || error.code !== 'rate_limited') return null;
  const seconds = (error.details as { retryAfterSeconds?: unknown } | undefined)?.retryAfterSeconds;
  return typeof seconds === 'number' && seconds > 0 ? Math.ceil(seconds) : null;
}

/**
 * Counts down the wait the sign-in limiter gave (server/auth/rate-limit.ts) once a second from the
 * moment the refusal arrived; 0 when there is nothing (left) to wait for.
 */
export function useRetryCountdown(error: unknown): number {
  const total = retryAfterSeconds(error);
  const [left, setLeft] = useState(0);
  useEffect(() => {
    if (total === null) return setLeft(0);
    const until = Date.now() + total * 1000;
    const tick = () => setLeft(Math.max(0, Math.ceil((until - Date.now()) / 1000)));
    tick();
    const timer = setInterval(tick, 1000);
    return () => clearInterval(timer);
  }, [error, total]);
  return left;
}
