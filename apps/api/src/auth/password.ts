import { hash, verify } from '@node-rs/argon2';

// argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1: the OWASP minimum)
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

let dummy: Promise<string> | null = null;

export async function verifyPassword(stored: string | null, password: string): Promise<boolean> {
  // with no stored hash, still spend the time of a verify, so an unknown e-mail answers like a wrong password
  dummy ??= hash('benchwright-timing-equaliser');
  const target = stored ?? (await dummy);
  const ok = await verify(target, password).catch(() => false);
  return stored !== null && ok;
}
