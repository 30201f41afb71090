// Vitest global setup for integration tests: a freshly migrated and seeded database, and the built app serving it.
import type { TestProject } from "vitest/node";
import { resetDatabase, testDatabaseUrl } from "./db";
import { startServer, type RunningServer } from "./server";

let server: RunningServer | null = null;

export default async function setup(project: TestProject) {
  const url = testDatabaseUrl("integration");
  await resetDatabase(url);
  server = await startServer({ port: Number(process.env.INTEGRATION_PORT ?? 3101), databaseUrl: url });
  project.provide("baseUrl", server.baseUrl);
  return async () => {
    await server?.stop();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}
