import { hash, verify } from "@node-rs/argon2";

/*
 * Passwords are hashed with argon2id (the @node-rs/argon2 default algorithm) at the parameters
 * recommended by OWASP's password storage guidance (19 MiB memory, 2 iterations, 1 lane).
 */
const ARGON2_OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
