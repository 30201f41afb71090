// Mail caught by the local fake mail server. Not team data: the development mailbox shows every caught mail.
import { db, type Db } from "@/lib/db/knex";
import type { Page } from "@/lib/validation/common";

export interface DevMailInput {
  messageId: string | null;
  fromAddress: string;
  toAddresses: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface DevMailRecord extends DevMailInput {
  id: number;
  receivedAt: string;
}

export async function insertDevMail(q: Db, m: DevMailInput): Promise<number> {
  const [row] = (await q("devMail")
    .insert({
      messageId: m.messageId,
      fromAddress: m.fromAddress,
      toAddresses: m.toAddresses.map((a) => a.toLowerCase()),
      subject: m.subject,
      text: m.text,
      html: m.html,
    })
    .returning("id")) as [{ id: number }];
  return row.id;
}

export async function listDevMail(
  query: { to?: string; limit: number; offset: number },
  q: Db = db(),
): Promise<Page<DevMailRecord>> {
  const base = q("devMail").modify((b) => {
    if (query.to) b.whereRaw("? = any(to_addresses)", [query.to.toLowerCase()]);
  });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const items = (await base
    .clone()
    .select("id", "messageId", "fromAddress", "toAddresses", "subject", "text", "html", "receivedAt")
    .orderBy("id", "desc")
    .limit(query.limit)
    .offset(query.offset)) as DevMailRecord[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}
