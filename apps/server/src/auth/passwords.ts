import { hash, parseOptions, verify } from '@node-rs/argon2';

export interface PasswordHasher {
  hash(password: string): Promise<string>;
  /** False for a wrong password and for a hash that cannot be read. */
  verify(passwordHash: string, password: string): Promise<boolean>;
  /** Spends the time of one verification without an account, so unknown e-mails answer as slowly as known ones. */
  verifyDummy(password: string): Promise<void>;
  /** True when a stored hash was made with other cost settings than today's. */
  needsRehash(passwordHash: string): boolean;
}

/** argon2id (the library's default algorithm) with the configured memory and time cost. */
export function createPasswordHasher({
  memoryKib,
  timeCost,
}: {
  memoryKib: number;
  timeCost: number;
}): PasswordHasher {
  const options = { memoryCost: memoryKib, timeCost, parallelism: 1 };
  // Made up front, so that even the first unknown e-mail costs one verification, not a hash and a verification.
  const dummy = hash('biasproof-dummy-password-for-timing', options);
  dummy.catch(() => undefined);
  const check = async (passwordHash: string, password: string) => {
    try {
      return await verify(passwordHash, password);
    } catch {
      return false;
    }
  };
  return {
    hash: (password) => hash(password, options),
    verify: check,
    async verifyDummy(password) {
      await check(await dummy, password);
    },
    needsRehash(passwordHash) {
      try {
        const o = parseOptions(passwordHash);
        return o.memoryCost !== memoryKib || o.timeCost !== timeCost;
      } catch {
        return true;
      }
    },
  };
}
