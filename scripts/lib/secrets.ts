import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

/** A random secret kept in a file (mode 600), made on first use and reused after. */
export function persistentSecret(file: string, bytes = 32): string {
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(bytes).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

export const randomSecret = (bytes = 32) => randomBytes(bytes).toString('base64url');
