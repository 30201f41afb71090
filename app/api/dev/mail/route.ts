import { readQuery, route } from "@/lib/http/handler";
import { devMailQuerySchema } from "@/lib/validation/team";
import { listDevMail } from "@/lib/db/dev-mail";
import { mailboxEnabled } from "@/lib/env";
import { notFound } from "@/lib/http/errors";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

// The development mailbox: every mail the local fake mail server caught. Absent (404) when the mailbox is off.
export const GET = route("GET /api/dev/mail", async ({ req }) => {
  if (!mailboxEnabled()) throw notFound("That page");
  return listDevMail(readQuery(req, devMailQuerySchema));
});
