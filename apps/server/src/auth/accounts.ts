// What other components may ask of accounts (they do not reach into auth's repository).
import type { Tx } from '../db/transactions.ts';
import type { UserRow } from '../db/models/user.ts';
import { createUser, findUserByEmail, findUserById } from './repository.ts';

export function findAccountByEmail(tx: Tx, email: string): Promise<UserRow | null> {
  return findUserByEmail(tx, email);
}

export function findAccount(tx: Tx, userId: string): Promise<UserRow | null> {
  return findUserById(tx, userId);
}

/** Creates an account; the caller has hashed the password (outside its transaction: hashing is slow on purpose). */
export function createAccount(
  tx: Tx,
  account: { email: string; name: string; passwordHash: string },
): Promise<UserRow> {
  return createUser(tx, account);
}
