import { createHash, randomBytes } from 'node:crypto';
import type { Db } from '../db/knex';

// Single-use password tokens (invitation and reset). The raw token goes only
// into the e-mail; the database keeps its SHA-256, so a leaked table is useless.

export type TokenPurpose = 'invite' | 'reset';
export const TOKEN_LIFETIME_MS = 48 * 60 * 60 * 1000;

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export async function issueToken(db: Db, userId: number, purpose: TokenPurpose, now = new Date()): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await db('password_tokens').insert({
    user_id: userId,
    token_hash: sha256(token),
    purpose,
    expires_at: new Date(now.getTime() + TOKEN_LIFETIME_MS),
  });
  return token;
}

/** Marks the token used and returns its account, or null when unknown, used or expired. */
export async function consumeToken(db: Db, token: string): Promise<number | null> {
  return db.transaction(async (trx) => {
    const row = await trx('password_tokens')
      .where({ token_hash: sha256(token) })
      .whereNull('used_at')
      .where('expires_at', '>', trx.fn.now())
      .forUpdate()
      .first('id', 'user_id');
    if (!row) return null;
    await trx('password_tokens').where({ id: row.id }).update({ used_at: trx.fn.now() });
    // One new password voids every other outstanding token of the account.
    await trx('password_tokens').where({ user_id: row.user_id }).whereNull('used_at').update({ used_at: trx.fn.now() });
    return row.user_id as number;
  });
}
