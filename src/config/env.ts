import { z } from "zod";

// Build-time settings from Vite's import.meta.env, parsed once so a bad value fails loudly at start.
const envSchema = z.object({
  VITE_API_BASE: z
    .string()
    .regex(/^\/[\w/-]*$/, "VITE_API_BASE must be a path on this origin, such as /api")
    .default("/api"),
  MODE: z.string().default("production"),
  DEV: z.boolean().default(false),
});

const parsed = envSchema.parse(import.meta.env);

export const env = {
  apiBase: parsed.VITE_API_BASE.replace(/\/$/, ""),
  mode: parsed.MODE,
  isDev: parsed.DEV,
} as const;
