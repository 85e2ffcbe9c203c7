import bcrypt from 'bcryptjs';

const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a fixed hash when the account has none, so timing does not reveal accounts.
  return bcrypt.compare(plain, hash ?? '$2b$10$CwTycUXWue0Thq9StjUM0uJ8DPLKXtZpX0f3a1cEY1Qx6r5I7ZvXq');
}
