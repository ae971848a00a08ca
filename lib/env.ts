// Every setting the app reads, validated once. `.env.example` documents each one.
import { z } from "zod";

const flag = z.enum(["on", "off"]);

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("production"),
  DATABASE_URL: z.string().url({ message: "DATABASE_URL must be a postgres:// URL" }),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  // This computer's HTTPS address on the shop's network, and the origins (comma-separated) sign-in accepts
  // besides APP_URL; `npm start` fills both from the names its certificate carries.
  LAN_URL: z.string().url().optional(),
  TRUSTED_ORIGINS: z.string().default(""),
  HTTPS_PORT: z.coerce.number().int().min(1).max(65535).default(3443),
  SHOP_CA_FILE: z.string().optional(),
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
  BETTER_AUTH_SECRET: z.string().min(32, "BETTER_AUTH_SECRET must be at least 32 characters"),
  AUTH_SIGNIN_LIMIT: z.coerce.number().int().min(1).max(1000).default(5),
  AUTH_SIGNIN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).max(10_000).default(20),
  AUTH_SIGNIN_ADDRESS_LIMIT: z.coerce.number().int().min(1).max(10_000).default(20),
  AUTH_SIGNIN_WINDOW_SECONDS: z.coerce.number().int().min(1).max(86_400).default(900),
  SMTP_URL: z.string().url().default("smtp://127.0.0.1:2525"),
  MAIL_FROM: z.string().min(3).default("Gusset <no-reply@gusset.invalid>"),
  LOCAL_MAILBOX: flag.default("off"),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("gusset-photos"),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  S3_FORCE_PATH_STYLE: flag.default("on"),
});

type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function parseEnv(source: Record<string, string | undefined>): Env {
  const result = envSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Gusset's settings are not valid:\n${lines.join("\n")}`);
  }
  return result.data;
}

// Read lazily, so that `next build` can import modules without a running database.
export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}
