// Configuration from the environment, parsed once at start-up. Errors name the variable.
import { z } from "zod";

const configSchema = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, "DATABASE_URL must be a postgres:// URL"),
  JWT_SECRET: z.string().min(32, "JWT_SECRET must be at least 32 characters"),
  PUBLIC_URL: z.url("PUBLIC_URL must be a URL such as http://127.0.0.1:8080").optional(),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, "SMTP_URL must be an smtp:// or smtps:// URL")
    .optional(),
  MAIL_FROM: z.string().default("Equipot <no-reply@equipot.test>"),
  STATIC_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  TRUST_PROXY: z.enum(["true", "false"]).default("false"),
  ACCESS_TOKEN_TTL_S: z.coerce.number().int().min(30).max(3600).default(900),
  REFRESH_TOKEN_TTL_S: z.coerce
    .number()
    .int()
    .min(3600)
    .default(30 * 24 * 3600),
  DEMO: z.enum(["true", "false"]).default("false"),
  STORAGE_DRIVER: z.enum(["disk", "s3"]).default("disk"),
  STORAGE_DIR: z.string().min(1).default(".equipot/files"),
  S3_ENDPOINT: z.url("S3_ENDPOINT must be a URL such as http://127.0.0.1:9000").optional(),
  S3_REGION: z.string().min(1).optional(),
  S3_BUCKET: z.string().min(1).optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("false"),
});

const s3Required = ["S3_REGION", "S3_BUCKET", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY"] as const;

// The S3 variables are optional for the disk driver but each one is needed for s3.
const configWithStorage = configSchema.superRefine((config, ctx) => {
  if (config.STORAGE_DRIVER !== "s3") return;
  for (const name of s3Required) {
    if (!config[name])
      ctx.addIssue({
        code: "custom",
        path: [name],
        message: `${name} is required when STORAGE_DRIVER=s3`,
      });
  }
});

export type Config = z.infer<typeof configSchema>;

export function parseConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const result = configWithStorage.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Equipot cannot start, the configuration is invalid:\n${lines.join("\n")}`);
  }
  return result.data;
}

export function publicUrl(config: Config): string {
  return config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`;
}
