import * as argon2 from 'argon2';

/** argon2id with the library's defaults (64 MiB, t=3): slow enough for passwords, ~50 ms here. */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

// Verified against when the e-mail is unknown, so both failures take the same time.
const DUMMY_HASH = '$argon2id$v=19$m=65536,t=3,p=4$2e9X++VurfysqaXq/mPPgQ$gGFOJCdpV+78nPSUIYWvdIpBJBC+9Mhyr84OJsB7D60';

export async function verifyPassword(hash: string | null | undefined, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash ?? DUMMY_HASH, password).then((ok) => ok && !!hash);
  } catch {
    return false;
  }
}
