import bcrypt from 'bcryptjs';

// bcrypt with a cost of at least 12. An unknown account is checked against a
// dummy hash of the same cost, so a wrong e-mail and a wrong password take the
// same time and answer the same message.

let dummyHash: Promise<string> | null = null;

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export async function verifyPassword(password: string, hash: string | null, cost: number): Promise<boolean> {
  if (hash) return bcrypt.compare(password, hash);
  dummyHash ??= bcrypt.hash('no account has this password', cost);
  await bcrypt.compare(password, await dummyHash);
  return false;
}
