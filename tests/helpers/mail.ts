// Reading caught mail in tests through GET /api/dev/mail, as a person reads the Mailbox page.
import net from "node:net";
import { Client } from "./http";

export interface CaughtMail {
  id: number;
  toAddresses: string[];
  subject: string;
  text: string;
  html: string | null;
  fromAddress: string;
}

/** Waits (up to `timeoutMs`) for a mail to `to` newer than `afterId`, and returns the newest. */
export async function waitForMail(
  baseUrl: string,
  to: string,
  opts: { afterId?: number; timeoutMs?: number } = {},
): Promise<CaughtMail> {
  const c = new Client(baseUrl);
  const deadline = Date.now() + (opts.timeoutMs ?? 8000);
  for (;;) {
    const r = await c.get<{ items: CaughtMail[] }>(`/api/dev/mail?to=${encodeURIComponent(to)}&limit=5`);
    const m = r.status === 200 ? r.body.items.find((x) => x.id > (opts.afterId ?? 0)) : undefined;
    if (m) return m;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived (last answer ${r.status})`);
    await new Promise((res) => setTimeout(res, 150));
  }
}

/** The id of the newest caught mail to `to` (0 when none), to wait for a newer one afterwards. */
export async function lastMailId(baseUrl: string, to: string): Promise<number> {
  const r = await new Client(baseUrl).get<{ items: CaughtMail[] }>(
    `/api/dev/mail?to=${encodeURIComponent(to)}&limit=1`,
  );
  return r.body.items[0]?.id ?? 0;
}

/** The first link in a mail's text whose path starts with `prefix`, e.g. "/invitations/". */
export function linkIn(mail: CaughtMail, prefix: string): { url: string; path: string; token: string } {
  const found = mail.text.match(/https?:\/\/\S+/g)?.find((u) => new URL(u).pathname.startsWith(prefix));
  if (!found) throw new Error(`no ${prefix} link in mail "${mail.subject}"`);
  const u = new URL(found);
  return { url: found, path: u.pathname, token: u.pathname.slice(prefix.length) };
}

/** A free loopback port (for a second app instance or a dead mail server). */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const a = s.address();
      const port = typeof a === "object" && a ? a.port : 0;
      s.close(() => resolve(port));
    });
  });
}
