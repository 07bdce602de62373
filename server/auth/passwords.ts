// bcrypt 6 ships a working binary on this Node (argon2's segfaults here; see stack notes).
import bcrypt from 'bcrypt';

const COST = 11;
// Compared against when the e-mail is unknown, so a failed sign-in takes the same time either way.
const DUMMY_HASH = bcrypt.hashSync('voltcrib-timing-equaliser', COST);

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return Boolean(hash) && matches;
}
