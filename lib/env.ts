import { z } from 'zod';

/**
 * The one place that reads process.env. The launchers in db/lifecycle fill these in
 * (secrets generated on first run under .data/<profile>/secrets.json); defaults fit the demo.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DUSKWATCH_PROFILE: z.enum(['demo', 'test']).default('demo'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3307),
  /** When set, the app talks to MariaDB over this Unix socket instead of TCP (faster on one machine). */
  DB_SOCKET: z.string().optional(),
  DB_NAME: z.string().regex(/^[a-z0-9_]+$/).default('duskwatch'),
  DB_USER: z.string().default('duskwatch_app'),
  DB_PASSWORD: z.string().default(''),
  DB_POOL_MAX: z.coerce.number().int().positive().default(16),
  /** Connections of the ingest pool: more commits in flight lets MariaDB group more of them per flush. */
  DB_INGEST_POOL_MAX: z.coerce.number().int().positive().default(32),
  APP_URL: z.string().url().default('http://127.0.0.1:3000'),
  NEXTAUTH_SECRET: z.string().min(32).optional(),
  DEVICE_TOKEN_SECRET: z.string().min(32).optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  MAIL_FROM: z.string().default('Duskwatch <alerts@duskwatch.example>'),
  MAIL_DIR: z.string().default('.data/mail'),
  UPLOAD_DIR: z.string().default('.data/uploads'),
  JOB_INTERVAL_SECONDS: z.coerce.number().positive().default(60),
  /**
   * Raw readings older than this many days are dropped a whole month partition at a time (the
   * rollups stay, so charts of old ranges still draw). `off` keeps them forever. At least 35 days,
   * so last month's raw readings are always there; 0 is refused as ambiguous (say `off`).
   */
  READINGS_RETENTION_DAYS: z
    .union([z.literal('off'), z.coerce.number().int().min(35, 'at least 35 days, or off')])
    .default(730)
    .transform((v) => (v === 'off' ? null : v)),
  /** The maintenance user (EXECUTE on the readings partition procedures only): set for the job runner alone, never for the app. */
  DB_MAINT_USER: z.string().default('duskwatch_maint'),
  DB_MAINT_PASSWORD: z.string().optional(),
});

export type Env = z.infer<typeof schema>;

let cached: Env | undefined;

export function getEnv(): Env {
  if (!cached) {
    const parsed = schema.safeParse(process.env);
    if (!parsed.success) {
      const detail = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
      throw new Error(`Invalid environment: ${detail}`);
    }
    cached = parsed.data;
  }
  return cached;
}

/** Secrets are required at run time; a missing one is a set-up fault, named plainly. */
export function requireSecret(name: 'NEXTAUTH_SECRET' | 'DEVICE_TOKEN_SECRET'): string {
  const value = getEnv()[name];
  if (!value) throw new Error(`${name} is not set: start the app through npm run demo or npm test`);
  return value;
}
