import bcrypt from "bcryptjs";

// bcrypt with cost 12: a well-known, deliberately slow hash (Provos & Mazières, 1999).
const COST = 12;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

// Compared against when the e-mail is unknown, so timing does not reveal whether it exists.
export const decoyHash = "$2b$12$C6UzMDM.H6dfI/f/IKcEeO5CzYzbtZ0aBvEe2TUKo2LYZ9f0YpYyq";
