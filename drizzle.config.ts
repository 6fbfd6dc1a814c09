import { defineConfig } from "drizzle-kit";
import { devDatabaseUrl } from "./scripts/dev-database-url";

export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema",
  out: "./drizzle",
  dbCredentials: { url: process.env.DATABASE_URL ?? devDatabaseUrl() },
});
