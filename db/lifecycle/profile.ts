import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** Everything that differs between the demo and the test stack. Test never touches demo data. */
export type ProfileName = 'demo' | 'test';

export interface Profile {
  name: ProfileName;
  root: string; // repository root
  dataDir: string; // .data/<profile>
  mysqlDir: string;
  socketPath: string;
  dbPort: number;
  dbName: string;
  appPort: number;
  smtpPort: number;
  mailDir: string;
  /** Next's build folder: separate per test slot so parallel builds never collide. */
  distDir: string;
}

const PORTS: Record<ProfileName, { db: number; app: number; smtp: number }> = {
  demo: { db: 3307, app: 3000, smtp: 2525 },
  test: { db: 3317, app: 3100, smtp: 2626 },
};

/**
 * `slot` lets several test stacks run side by side on one machine (each its own data dir,
 * ports and build folder): DUSKWATCH_TEST_SLOT=N for N ≥ 1. Slot 0 is the usual one.
 */
export function resolveProfile(name: ProfileName, root = process.cwd(), slot = 0): Profile {
  const suffix = name === 'test' && slot > 0 ? `-${slot}` : '';
  const dataDir = path.join(root, '.data', name + suffix);
  const offset = name === 'test' ? slot * 10 : 0;
  return {
    name,
    root,
    dataDir,
    mysqlDir: path.join(dataDir, 'mysql'),
    socketPath: path.join(dataDir, 'mysqld.sock'),
    dbPort: PORTS[name].db + offset,
    dbName: name === 'demo' ? 'duskwatch' : 'duskwatch_test',
    appPort: PORTS[name].app + offset,
    smtpPort: PORTS[name].smtp + offset,
    // Tests build into their own folder, so `npm test` never swaps the build under a running demo.
    distDir: name === 'test' ? `.next-test${suffix}` : '.next',
    // The demo's catcher writes where the README says: .data/mail/.
    mailDir: name === 'demo' ? path.join(root, '.data', 'mail') : path.join(dataDir, 'mail'),
  };
}

interface Secrets {
  dbPassword: string;
  /** The maintenance user's (partition upkeep of readings); added to older secrets files on first use. */
  maintPassword: string;
  nextAuthSecret: string;
  deviceTokenSecret: string;
}

/** Generated once per profile, kept under .data/ (git-ignored), never committed. */
export function loadSecrets(profile: Profile): Secrets {
  const file = path.join(profile.dataDir, 'secrets.json');
  const stored = existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as Partial<Secrets>) : {};
  const secrets: Secrets = {
    dbPassword: stored.dbPassword ?? randomBytes(18).toString('base64url'),
    maintPassword: stored.maintPassword ?? randomBytes(18).toString('base64url'),
    nextAuthSecret: stored.nextAuthSecret ?? randomBytes(32).toString('base64url'),
    deviceTokenSecret: stored.deviceTokenSecret ?? randomBytes(32).toString('base64url'),
  };
  if (Object.keys(stored).length < Object.keys(secrets).length) {
    mkdirSync(profile.dataDir, { recursive: true });
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  }
  return secrets;
}

/** The maintenance user's sign-in: given to the job runner only, so the app never holds DDL rights. */
export function maintenanceEnv(profile: Profile): Record<string, string> {
  return { DB_MAINT_USER: 'duskwatch_maint', DB_MAINT_PASSWORD: loadSecrets(profile).maintPassword };
}

/** The environment every process of this profile runs with (parsed again by lib/env.ts). */
export function profileEnv(profile: Profile): Record<string, string> {
  const secrets = loadSecrets(profile);
  return {
    DUSKWATCH_PROFILE: profile.name,
    NEXT_TELEMETRY_DISABLED: '1',
    DB_HOST: '127.0.0.1',
    DB_PORT: String(profile.dbPort),
    DB_SOCKET: profile.socketPath,
    DB_NAME: profile.dbName,
    DB_USER: 'duskwatch_app',
    DB_PASSWORD: secrets.dbPassword,
    APP_URL: `http://127.0.0.1:${profile.appPort}`,
    NEXTAUTH_URL: `http://127.0.0.1:${profile.appPort}`,
    NEXTAUTH_SECRET: secrets.nextAuthSecret,
    DEVICE_TOKEN_SECRET: secrets.deviceTokenSecret,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(profile.smtpPort),
    MAIL_DIR: profile.mailDir,
    UPLOAD_DIR: path.join(profile.dataDir, 'uploads'),
    NEXT_DIST_DIR: profile.distDir,
  };
}

/** The test profile of this process (npm test sets DUSKWATCH_TEST_SLOT when it is not 0). */
export function currentTestProfile(root = process.cwd()): Profile {
  return resolveProfile('test', root, Number(process.env.DUSKWATCH_TEST_SLOT ?? 0) || 0);
}
