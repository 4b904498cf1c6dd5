import { parseConfig, type Config } from "../../server/config";

export function testConfig(overrides: Record<string, string> = {}): Config {
  return parseConfig({
    NODE_ENV: "test",
    DATABASE_URL: "postgres://unused/unused",
    JWT_SECRET: "test-secret-that-is-long-enough-for-hs256-0123456789",
    LOG_LEVEL: "silent",
    HOST: "127.0.0.1",
    PORT: "0",
    ...overrides,
  });
}
