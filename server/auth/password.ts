import { hash, verify } from '@node-rs/argon2';

/**
 * argon2id with m = 19456 KiB (19 MiB), t = 2, p = 1: the first configuration the OWASP Password
 * Storage Cheat Sheet recommends for argon2id. The algorithm is the library default (argon2id);
 * the parameters travel inside the PHC string, so raising them later still verifies old hashes.
 */
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** A real hash to verify against for unknown e-mails, so both answers cost the same time. */
let decoy: Promise<string> | undefined;
export function decoyHash(): Promise<string> {
  return (decoy ??= hashPassword('decoy password that matches nothing'));
}
