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
  /** `off`: no read answer is kept (the bench measures the real paths with it). */
  ANSWER_CACHE: z.enum(['on', 'off']).default('on'),
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
  if (isProduction) {
    const problems = productionProblems(env, source);
    if (problems.length) throw new Error(`Refusing to start with NODE_ENV=production:\n${problems.map((p) => `  ${p}`).join('\n')}`);
  }
  return {
    ...env,
    LOG_LEVEL: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    dataDir: path.resolve(env.DATA_DIR),
    localProviders: !isProduction && !env.OAUTH_AUTHORIZE_URL,
    isProduction,
  };
}

/** The local stand-ins' development credentials: never accepted in production. */
const DEVELOPMENT_VALUES: Partial<Record<keyof z.infer<typeof envSchema>, string>> = {
  OAUTH_CLIENT_ID: 'edgeledger-local',
  OAUTH_CLIENT_SECRET: 'edgeledger-local-secret',
  S3_ACCESS_KEY: 'S3RVER',
  S3_SECRET_KEY: 'S3RVER',
};

/**
 * What keeps `env` from running in production, one line per setting, each naming it: production
 * fails closed, so no local stand-in (OAuth2 provider, mail catcher, S3 fake), no demo data and
 * no development secret ever runs there. `source` tells a setting given from one left at its default.
 */
function productionProblems(env: z.infer<typeof envSchema>, source: NodeJS.ProcessEnv): string[] {
  const problems: string[] = [];
  const missing = (name: string, why: string) => problems.push(`${name}: required in production (${why})`);
  if (!env.SESSION_SECRET) missing('SESSION_SECRET', 'at least 32 random characters signing the session cookie');
  else if (env.SESSION_SECRET.length < 32) problems.push('SESSION_SECRET: at least 32 characters in production');
  if (!env.PUBLIC_URL) missing('PUBLIC_URL', 'the https:// address people reach; sign-in and links in e-mail are built from it');
  else if (new URL(env.PUBLIC_URL).protocol !== 'https:') problems.push('PUBLIC_URL: must be an https:// address in production');
  const oauth = { OAUTH_AUTHORIZE_URL: env.OAUTH_AUTHORIZE_URL, OAUTH_TOKEN_URL: env.OAUTH_TOKEN_URL, OAUTH_USERINFO_URL: env.OAUTH_USERINFO_URL };
  for (const [name, value] of Object.entries(oauth)) if (!value) missing(name, 'the hosted OAuth2 provider; the local stand-in never runs in production');
  if (!env.SMTP_HOST) missing('SMTP_HOST', 'the SMTP server that sends e-mail; the local mail catcher never runs in production');
  if (!env.S3_ENDPOINT) missing('S3_ENDPOINT', 'the S3-compatible bucket for photos; the local S3 fake never runs in production');
  for (const [name, value] of Object.entries(DEVELOPMENT_VALUES)) {
    if (!source[name]) missing(name, 'its development default is refused');
    else if (source[name] === value) problems.push(`${name}: the development value is refused in production`);
  }
  if (source.SEED_DEMO && env.SEED_DEMO !== 'never') problems.push('SEED_DEMO: the invented demo data is never loaded in production; leave it unset or set it to never');
  return problems;
}
