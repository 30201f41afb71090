// `tsx scripts/fake-smtp.ts`: the local fake mail server on SMTP_URL's loopback port, storing into DATABASE_URL.
import { startFakeSmtp } from "@/lib/mail/fake-smtp";

async function main(): Promise<void> {
  const url = new URL(process.env.SMTP_URL ?? "smtp://127.0.0.1:2525");
  if (!["127.0.0.1", "localhost"].includes(url.hostname))
    throw new Error(
      `SMTP_URL ${url.host} is not on loopback; the fake mail server only listens on 127.0.0.1`,
    );
  const databaseUrl = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/loomwright";
  const smtp = await startFakeSmtp({ port: Number(url.port || 2525), databaseUrl, log: true });
  console.log(`[fake-smtp] catching mail on ${smtp.url}`);
  const stop = () => {
    void smtp.close().finally(() => process.exit(0));
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

main().catch((e: unknown) => {
  console.error("[fake-smtp]", e instanceof Error ? e.message : e);
  process.exit(1);
});
