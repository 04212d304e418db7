import { randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

// Same parameters and "salt:key" hex format as Lucia's Scrypt (N=16384, r=16, p=1, 64-byte key, salt used as
// its hex text), but on libuv's thread pool via node:crypto so a sign-in never blocks the event loop.
const N = 16384;
const r = 16;
const p = 1;
const keyLength = 64;
const maxmem = 64 * 1024 * 1024;

function derive(password: string, salt: string): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(password.normalize('NFKC'), salt, keyLength, { N, r, p, maxmem }, (err, key) =>
      err ? reject(err) : resolve(key),
    ),
  );
}

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16).toString('hex');
  const key = await derive(password, salt);
  return `${salt}:${key.toString('hex')}`;
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  const [salt, keyHex] = hash.split(':');
  if (!salt || !keyHex) return false;
  const expected = Buffer.from(keyHex, 'hex');
  const actual = await derive(password, salt);
  return expected.length === actual.length && timingSafeEqual(expected, actual);
}

// A fixed hash to compare against when the e-mail is unknown, so a miss takes as long as a wrong password.
let dummyHash: Promise<string> | undefined;
export function dummyPasswordHash() {
  dummyHash ??= hashPassword('not-a-real-password-for-timing-only');
  return dummyHash;
}
