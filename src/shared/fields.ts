import { z } from 'zod';

// Field rules reused by several schemas, so a name means the same thing everywhere.

export const NAME_MAX = 200;
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

export const email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email('Enter a valid e-mail address.'));

export const displayName = z
  .string()
  .trim()
  .min(1, 'Enter a name.')
  .max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`);

export const password = z
  .string()
  .min(PASSWORD_MIN, `A password has at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`);

/** Path ids are positive integers; anything else is an unknown id (404), not a 400. */
export const idParam = z.coerce.number().int().positive().max(2 ** 31 - 1);
