// Vitest global setup for integration tests: a freshly migrated and seeded database, the local fake mail server
// (on a free port, storing into the same database) and the built app serving it with the mailbox on.
import type { TestProject } from "vitest/node";
import { startFakeSmtp, type FakeSmtp } from "@/lib/mail/fake-smtp";
import { resetDatabase, testDatabaseUrl } from "./db";
import { startServer, type RunningServer } from "./server";

let server: RunningServer | null = null;
let smtp: FakeSmtp | null = null;

export default async function setup(project: TestProject) {
  const url = testDatabaseUrl("integration");
  await resetDatabase(url);
  smtp = await startFakeSmtp({ port: 0, databaseUrl: url });
  server = await startServer({
    port: Number(process.env.INTEGRATION_PORT ?? 3101),
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

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    smtpUrl: string;
  }
}
