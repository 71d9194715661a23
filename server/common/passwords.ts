import bcrypt from 'bcryptjs';

/** bcrypt cost 11: about 0.1 s per hash here, slow enough for guessing, quick enough for sign-in. */
export const BCRYPT_COST = 11;

export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, BCRYPT_COST);
export const checkPassword = (password: string, hash: string): Promise<boolean> => bcrypt.compare(password, hash);

/** A hash of nothing, compared against when the account is unknown so timing does not reveal which e-mails exist. */
export const DUMMY_HASH = bcrypt.hashSync('no such account', 4);
