import bcrypt from 'bcryptjs';

/** bcrypt with cost 10 (OWASP Password Storage Cheat Sheet's minimum for bcrypt). */
const COST = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, COST);

export const verifyPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/** Compared against when the e-mail is unknown, so both failures take the same time. */
export const UNKNOWN_USER_HASH = bcrypt.hashSync('no-such-user-placeholder', COST);
