import { hash, verify } from "@node-rs/argon2";

/*
 * Passwords are hashed with argon2id (the @node-rs/argon2 default algorithm) with 64 MiB of memory and 3 passes,
 * the memory and pass count of RFC 9106 §4 (second recommended option), one lane: about 50–100 ms per sign-in here.
 */
const ARGON2_OPTIONS = {
  memoryCost: 65_536,
  timeCost: 3,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(
  passwordHash: string,
  password: string,
): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
