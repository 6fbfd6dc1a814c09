import { hash, verify } from "@node-rs/argon2";

// argon2id, 19 MiB, 2 passes, 1 lane: the minimum the OWASP Password Storage Cheat Sheet gives
// for argon2id (quoted from memory). Algorithm 2 is argon2id in @node-rs/argon2's enum.
const options = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Spends the same work as a real check, for sign-ins with an unknown e-mail, so response time
 * does not reveal which addresses have accounts.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword("edgewise-timing-equaliser");
  await verifyPassword(await dummyHash, password);
  return false;
}
