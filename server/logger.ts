import pino, { type Logger } from 'pino';
import type { Config } from './config';

export function createLogger(config: Pick<Config, 'LOG_LEVEL' | 'NODE_ENV'>): Logger {
  return pino({ level: config.NODE_ENV === 'test' ? 'silent' : config.LOG_LEVEL, redact: ['req.headers.cookie', 'req.headers["x-xsrf-token"]'] });
}
