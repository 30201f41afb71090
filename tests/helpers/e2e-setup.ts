// Vitest global setup for end-to-end tests: the demo database, the local fake mail server and the built app on its
// own port with the mailbox on.
import type { TestProject } from "vitest/node";
import { startFakeSmtp, type FakeSmtp } from "@/lib/mail/fake-smtp";
import { resetDatabase, testDatabaseUrl } from "./db";
import { startServer, type RunningServer } from "./server";

let server: RunningServer | null = null;
let smtp: FakeSmtp | null = null;

export default async function setup(project: TestProject) {
  const url = testDatabaseUrl("e2e");
  await resetDatabase(url);
  smtp = await startFakeSmtp({ port: 0, databaseUrl: url });
  server = await startServer({
    port: Number(process.env.E2E_PORT ?? 3102),
    databaseUrl: url,
    env: { SMTP_URL: smtp.url, DEV_MAILBOX: "1" },
  });
  project.provide("baseUrl", server.baseUrl);
  project.provide("smtpUrl", smtp.url);
  return async () => {
    await server?.stop();
    await smtp?.close();
  };
}
