import { z } from 'zod';
import { isIP } from 'node:net';
import { clockFromEnv } from './clock/clock';

/** Express's own names for address ranges (proxy-addr). */
const namedRanges = new Set(['loopback', 'linklocal', 'uniquelocal']);

/**
 * TRUST_PROXY as Express's 'trust proxy' setting takes it: off (empty, false, 0, no, off), one hop
 * (true, yes, on), a hop count (2), or a list of addresses, subnets and Express's names
 * (loopback, 10.0.0.0/8). Anything else stops the start, since a misread value trusts forged
 * X-Forwarded-For addresses (and with them the sign-in limits).
 */
function trustProxyOf(text: string | undefined, context: z.RefinementCtx): false | number | string[] {
  const value = (text ?? '').trim().toLowerCase();
  if (['', 'false', '0', 'no', 'off'].includes(value)) return false;
  if (['true', 'yes', 'on'].includes(value)) return 1;
  if (/^\d+$/.test(value)) return Number(value);
  const entries = value.split(',').map((entry) => entry.trim());
  const isAddress = (entry: string) => {
    const [address, bits, ...rest] = entry.split('/');
    if (rest.length || !isIP(address)) return false;
    return bits === undefined || (/^\d+$/.test(bits) && Number(bits) <= (isIP(address) === 4 ? 32 : 128));
  };
  if (entries.every((entry) => namedRanges.has(entry) || isAddress(entry))) return entries;
  context.addIssue({ code: 'custom', message: `"${text}" is not off (false), a hop count, or a list of addresses, subnets or loopback/linklocal/uniquelocal` });
  return false;
}

// Read and validate process.env once; fail fast with a message that names the variable.
const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_USER: z.string().default('kerfcast'),
  DB_PASSWORD: z.string().default('kerfcast-local-only'),
  DB_NAME: z.string().default('kerfcast'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Kerfcast <no-reply@kerfcast.test>'),
  SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters').default('kerfcast-development-secret-change-me'),
  PUBLIC_URL: z.string().url().optional(),
  UPLOAD_LIMIT_MB: z.coerce.number().positive().default(25),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIST: z.string().default('dist/kerfcast/browser'),
  TRUST_PROXY: z.string().optional().transform((text, context) => trustProxyOf(text, context)),
});

export type Config = z.infer<typeof schema> & { publicUrl: string };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const config = parsed.data;
  if (config.NODE_ENV === 'production' && config.SESSION_SECRET.startsWith('kerfcast-development')) {
    throw new Error('Invalid configuration:\n  SESSION_SECRET: set a secret of your own in production');
  }
  try {
    // KERFCAST_TODAY / KERFCAST_NOW pin the date outside production; refused in it.
    clockFromEnv({ ...env, NODE_ENV: config.NODE_ENV });
  } catch (error) {
    throw new Error(`Invalid configuration:\n  ${(error as Error).message}`);
  }
  return { ...config, publicUrl: config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}` };
}
