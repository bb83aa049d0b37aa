import { CookieAccessInfo } from 'cookiejar';
import type { Logger } from 'pino';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/auth/passwords';
import { loadConfig, type Config } from '../../server/config';
import { createDb } from '../../server/db';
import { createLogger } from '../../server/logger';
import type { SignInLimits } from '../../server/auth/auth-router';
import type { Role } from '@shared/contracts/auth';

export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: process.env['TEST_DB_NAME'] ?? 'kerfcast_test', CLIENT_DIST: 'does-not-exist', ...overrides });
}

export interface TestApp {
  app: Express;
  db: Knex;
  config: Config;
  close(): Promise<void>;
}

export function makeTestApp(options: { signInLimits?: SignInLimits; config?: Config; log?: Logger } = {}): TestApp {
  const config = options.config ?? testConfig();
  const db = createDb(config, { min: 0, max: 5 });
  const app = createApp({ config, db, log: options.log ?? createLogger(config), signInLimits: options.signInLimits });
  return { app, db, config, close: () => db.destroy() };
}

let counter = 0;
/** A unique e-mail per call, so test files never collide in the shared test database. */
export function uniqueEmail(label: string): string {
  counter += 1;
  return `${label}-${process.pid}-${Date.now()}-${counter}@example.test`;
}

export const testPassword = 'correct-horse-battery';
let cachedHash: Promise<string> | null = null;

/** Inserts a studio with one member per role given, straight into the database (no HTTP). */
export async function makeStudio(db: Knex, roles: Role[] = ['owner', 'partner', 'crew'], name = 'Test studio') {
  cachedHash ??= hashPassword(testPassword);
  const passwordHash = await cachedHash;
  const [studioId] = await db('studios').insert({ name });
  const members: Partial<Record<Role, { id: number; email: string }>> = {};
  for (const role of roles) {
    const email = uniqueEmail(role);
    const [userId] = await db('users').insert({ email, name: `${role} person`, password_hash: passwordHash });
    await db('memberships').insert({ studio_id: studioId, user_id: userId, role });
    members[role] = { id: userId, email };
  }
  return { studioId, members: members as Record<Role, { id: number; email: string }> };
}

export type Agent = ReturnType<typeof request.agent> & { xsrf: string };

/**
 * A cookie-keeping client that has fetched its XSRF-TOKEN and echoes the one it holds on every
 * request, as Angular does: the server hands out a new token on sign-in and sign-out (csrf.ts).
 */
export async function anonymousAgent(app: Express): Promise<Agent> {
  const agent = request.agent(app) as Agent;
  const held = () => {
    const cookie = agent.jar.getCookies(CookieAccessInfo.All).find((one) => one.name === 'XSRF-TOKEN');
    return cookie ? decodeURIComponent(cookie.value) : '';
  };
  for (const method of ['get', 'post', 'put', 'patch', 'delete'] as const) {
    const send = agent[method].bind(agent);
    agent[method] = ((url: string) => {
      const token = held();
      const test = send(url);
      return token ? test.set('X-XSRF-TOKEN', token) : test;
    }) as (typeof agent)[typeof method];
  }
  await agent.get('/api/auth/me');
  if (!held()) throw new Error('no XSRF-TOKEN cookie on GET /api/auth/me');
  Object.defineProperty(agent, 'xsrf', { get: held });
  return agent;
}

export async function signIn(app: Express, email: string, password = testPassword): Promise<Agent> {
  const agent = await anonymousAgent(app);
  const response = await agent.post('/api/auth/login').send({ email, password });
  if (response.status !== 200) throw new Error(`sign-in failed: ${response.status} ${JSON.stringify(response.body)}`);
  return agent;
}
