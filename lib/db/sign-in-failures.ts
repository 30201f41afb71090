// Failed sign-in attempts in PostgreSQL, so the limits hold across restarts and across app processes.
import { db, type Db } from "@/lib/db/knex";

export interface FailureCounts {
  email: number;
  clientIp: number;
}

export async function countRecentFailures(
  email: string,
  clientIp: string,
  windowS: number,
  q: Db = db(),
): Promise<FailureCounts> {
  const { rows } = (await q.raw(
    `select count(*) filter (where email = ?)::int as email, count(*) filter (where client_ip = ?)::int as client_ip
       from sign_in_failure
      where created_at > now() - make_interval(secs => ?) and (email = ? or client_ip = ?)`,
    [email, clientIp, windowS, email, clientIp],
  )) as { rows: FailureCounts[] };
  return rows[0] ?? { email: 0, clientIp: 0 };
}

/** Seconds until fewer than `limit` failures of this address or client remain in the window. */
export async function secondsUntilBelowLimit(
  column: "email" | "clientIp",
  value: string,
  limit: number,
  windowS: number,
  q: Db = db(),
): Promise<number> {
  const row = (await q("signInFailure")
    .where(column, value)
    .where("createdAt", ">", q.raw("now() - make_interval(secs => ?)", [windowS]))
    .orderBy("createdAt", "desc")
    .offset(limit - 1)
    .first(
      q.raw("extract(epoch from (created_at + make_interval(secs => ?) - now()))::float as wait_s", [
        windowS,
      ]),
    )) as { waitS: number } | undefined;
  return row ? Math.max(1, Math.ceil(row.waitS)) : 1;
}

export async function recordFailure(email: string, clientIp: string, q: Db = db()): Promise<void> {
  await q("signInFailure").insert({ email, clientIp });
  // Rows older than a day count for nothing; drop them as we go.
  await q("signInFailure").where("createdAt", "<", q.raw("now() - interval '1 day'")).del();
}

/** A successful sign-in (or password reset) clears the address's count; the client's count stays. */
export async function clearFailures(email: string, q: Db = db()): Promise<void> {
  await q("signInFailure").where({ email }).del();
}
