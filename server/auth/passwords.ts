// Password hashing with bcrypt (bcryptjs, pure JS).
import bcrypt from 'bcryptjs';

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// A hash of a random string that nobody knows, made once per cost: comparing against it for an
// unknown e-mail makes that answer take as long as a wrong password does.
const dummyHashes = new Map<number, string>();

export async function burnPasswordCheck(password: string, cost: number): Promise<false> {
  let dummy = dummyHashes.get(cost);
  if (!dummy) {
    dummy = await bcrypt.hash(crypto.randomUUID(), cost);
    dummyHashes.set(cost, dummy);
  }
  await bcrypt.compare(password, dummy);
  return false;
}
