// Vitest global setup for end-to-end tests: the demo database and the built app on its own port.
import type { TestProject } from "vitest/node";
import { resetDatabase, testDatabaseUrl } from "./db";
import { startServer, type RunningServer } from "./server";

let server: RunningServer | null = null;

export default async function setup(project: TestProject) {
  const url = testDatabaseUrl("e2e");
  await resetDatabase(url);
  server = await startServer({ port: Number(process.env.E2E_PORT ?? 3102), databaseUrl: url });
  project.provide("baseUrl", server.baseUrl);
  return async () => {
    await server?.stop();
  };
}
