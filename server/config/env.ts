import path from 'node:path';
import { z } from 'zod';

const port = z.coerce.number().int().min(0).max(65535);

/** Environment, validated once at start-up. Every setting has an embedded default. */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port.default(3000),
  DATA_DIR: z.string().default('data'),
  DATABASE_URL: z.string().optional(),
  SQLITE_SYNCHRONOUS: z.enum(['NORMAL', 'FULL']).default('NORMAL'),
  PUBLIC_URL: z.string().url().optional(),
  SESSION_SECRET: z.string().min(16).optional(),
  OAUTH_PORT: port.default(3001),
  OAUTH_AUTHORIZE_URL: z.string().url().optional(),
  OAUTH_TOKEN_URL: z.string().url().optional(),
  OAUTH_USERINFO_URL: z.string().url().optional(),
  OAUTH_CLIENT_ID: z.string().default('edgeledger-local'),
  OAUTH_CLIENT_SECRET: z.string().default('edgeledger-local-secret'),
  SMTP_PORT: port.default(3025),
  SMTP_HOST: z.string().optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Edgeledger <no-reply@edgeledger.test>'),
  /** S3-compatible object store for photos; unset: the local fake (s3rver) under DATA_DIR/s3. */
  S3_ENDPOINT: z.string().url().optional(),
  S3_BUCKET: z.string().min(3).max(63).default('edgeledger'),
  S3_ACCESS_KEY: z.string().default('S3RVER'),
  S3_SECRET_KEY: z.string().default('S3RVER'),
  S3_REGION: z.string().default('us-east-1'),
  /** Port of the local S3 fake; 0 picks a free one (only this process talks to it). */
  S3_PORT: port.default(0),
  SEED_DEMO: z.enum(['auto', 'never']).default('auto'),
  // Unset: 'silent' under NODE_ENV=test, 'info' otherwise (see loadEnv).
  LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).optional(),
  /** Number of reverse proxies in front of the server whose X-Forwarded-* headers are trusted; 0: none. */
  TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
  /** Session idle timeout, minutes without a request (fractions allowed). */
  SESSION_IDLE_MINUTES: z.coerce.number().positive().max(60 * 24 * 30).default(120),
  /** Session absolute timeout, hours since sign-in whatever the activity. */
  SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().max(24 * 90).default(24),
  /** Rate limits per client per minute (signed-in: per account; otherwise per address). */
  RATE_LIMIT_SIGNIN_PER_MIN: z.coerce.number().int().positive().default(20),
  RATE_LIMIT_POSTS_PER_MIN: z.coerce.number().int().positive().default(60),
  RATE_LIMIT_UPLOADS_PER_MIN: z.coerce.number().int().positive().default(30),
  RATE_LIMIT_SEARCH_PER_MIN: z.coerce.number().int().positive().default(300),
});

export type Env = Omit<z.infer<typeof envSchema>, 'LOG_LEVEL'> & {
  LOG_LEVEL: NonNullable<z.infer<typeof envSchema>['LOG_LEVEL']>;
  /** Absolute data folder. */
  dataDir: string;
  /** Whether the local stand-ins (OAuth provider, mail catcher) run in this process. */
  localProviders: boolean;
  isProduction: boolean;
};

/** Parses `source` (process.env by default); throws with every bad variable named. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const isProduction = env.NODE_ENV === 'production';
  if (isProduction && !env.SESSION_SECRET) throw new Error('Invalid environment:\n  SESSION_SECRET: required in production');
  return {
    ...env,
    LOG_LEVEL: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    dataDir: path.resolve(env.DATA_DIR),
    localProviders: !env.OAUTH_AUTHORIZE_URL,
    isProduction,
  };
}
