import { hash, verify } from '@node-rs/argon2';

// Source: OWASP Password Storage Cheat Sheet, argon2id minimum m=19 MiB, t=2, p=1.
// algorithm 2 is argon2id (the package's const enum cannot be imported under verbatimModuleSyntax).
const ARGON2ID = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2ID);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
