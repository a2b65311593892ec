// Server-only: staff passwords are stored as bcrypt hashes (cost 12), never in plain text.
import bcrypt from 'bcryptjs';

const COST = 12;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a dummy hash when there is none, so timing does not reveal unknown e-mails.
  return bcrypt.compare(plain, hash ?? '$2b$12$C6UzMDM.H6dfI/f/IKcEeO5uZ1LcqaFJJ6oO6rZDxqkHZ1o5YdB1W');
}
