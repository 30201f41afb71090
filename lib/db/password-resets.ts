// Password-reset links: single use, one hour, stored as the sha-256 of the token.
import { db, type Db, type Tx } from "@/lib/db/knex";

export interface PasswordResetRecord {
  id: string;
  userId: string;
  email: string;
  name: string;
  expiresAt: string;
  usedAt: string | null;
}

export async function insertPasswordReset(
  userId: string,
  tokenHash: string,
  expiresAt: Date,
  q: Db = db(),
): Promise<void> {
  await q("passwordReset").insert({ userId, tokenHash, expiresAt });
}

export async function findPasswordResetByTokenHash(
  tokenHash: string,
  q: Db = db(),
): Promise<PasswordResetRecord | null> {
  const row = (await q("passwordReset as r")
    .join("appUser as u", "u.id", "r.userId")
    .where("r.tokenHash", tokenHash)
    .select("r.id", "r.userId", "u.email", "u.name", "r.expiresAt", "r.usedAt")
    .first()) as PasswordResetRecord | undefined;
  return row ?? null;
}

/** Uses the link if it is still unused and unexpired; returns its user, or null when another use won. */
export async function claimPasswordReset(trx: Tx, tokenHash: string): Promise<string | null> {
  const rows = (await trx("passwordReset")
    .where({ tokenHash })
    .whereNull("usedAt")
    .where("expiresAt", ">", trx.fn.now())
    .update({ usedAt: trx.fn.now() })
    .returning("userId")) as { userId: string }[];
  return rows[0]?.userId ?? null;
}

/** After a reset every other open link of the user stops working too. */
export async function useAllPasswordResets(trx: Tx, userId: string): Promise<void> {
  await trx("passwordReset").where({ userId }).whereNull("usedAt").update({ usedAt: trx.fn.now() });
}
