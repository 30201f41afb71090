// The local fake mail server for development, the demo and tests: accepts any mail on loopback and stores it in the
// dev_mail table, where the Mailbox page and GET /api/dev/mail show it. Never part of the Next bundle.
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { makeKnex } from "@/lib/db/knex";
import { insertDevMail } from "@/lib/db/dev-mail";

export interface FakeSmtp {
  port: number;
  url: string;
  close: () => Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((o) => o.value.map((v) => v.address ?? "")).filter(Boolean);
}

/** Starts the server on 127.0.0.1:`port` (0 picks a free port) storing mail into `databaseUrl`. */
export async function startFakeSmtp(opts: {
  port: number;
  databaseUrl: string;
  log?: boolean;
}): Promise<FakeSmtp> {
  const knex = makeKnex(opts.databaseUrl, { camel: true, poolMax: 2 });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
      simpleParser(stream)
        .then(async (m) => {
          const to = addresses(m.to);
          const id = await insertDevMail(knex, {
            messageId: m.messageId ?? null,
            fromAddress:
              addresses(m.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ""),
            toAddresses: envelopeTo.length > 0 ? envelopeTo : to,
            subject: m.subject ?? "(no subject)",
            text: m.text ?? "",
            html: typeof m.html === "string" ? m.html : null,
          });
          if (opts.log) console.log(`[fake-smtp] #${id} to ${envelopeTo.join(", ")}: ${m.subject ?? ""}`);
          callback();
        })
        .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  server.on("error", (e) => console.error("[fake-smtp]", e.message));
  const addr = server.server.address();
  const port = typeof addr === "object" && addr ? addr.port : opts.port;
  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    close: async () => {
      await new Promise<void>((r) => server.close(() => r()));
      await knex.destroy();
    },
  };
}
