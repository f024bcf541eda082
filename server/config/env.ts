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
  SEED_DEMO: z.enum(['auto', 'never']).default('auto'),
  LOG_LEVEL: z.enum(['silent', 'error', 'info']).default('info'),
});

export type Env = z.infer<typeof envSchema> & {
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
    dataDir: path.resolve(env.DATA_DIR),
    localProviders: !env.OAUTH_AUTHORIZE_URL,
    isProduction,
  };
}
