import * as argon2 from 'argon2';

/** argon2id with the library's defaults (RFC 9106 second recommended option: 64 MiB, t=3). */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/**
 * A fixed hash to verify against when the e-mail is unknown, so that a wrong e-mail takes as long
 * as a wrong password and the answer's timing does not tell which part was wrong.
 */
let decoy: Promise<string> | null = null;
export function decoyHash(): Promise<string> {
  decoy ??= hashPassword('not-a-real-password-but-the-same-cost');
  return decoy;
}
