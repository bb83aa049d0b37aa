import type { Role } from '@shared/contracts/auth';
import { routesOf } from '../helpers/route-table';
import { anonymousAgent, makeStudio, makeTestApp, signIn, type Agent, type TestApp } from '../helpers/test-app';

// Who may call each route the app mounts. The test reads the routes from Express itself, so a route
// added without a line here fails it. 'public': anyone (health, sign-in, tokens in the path);
// 'signed-in': any account, no studio; a list of roles: members of the studio in the path.
type Access = 'public' | 'signed-in' | readonly Role[];
const everyone = ['owner', 'partner', 'crew'] as const;
const planners = ['owner', 'partner'] as const;
const owners = ['owner'] as const;

const table: Record<string, Access> = {
  'GET /api/health': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/signup': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/me': 'signed-in',
  'POST /api/auth/password-reset': 'public',
  'POST /api/auth/password-reset/:token': 'public',
  'GET /api/account/profile': 'signed-in',
  'PATCH /api/account/profile': 'signed-in',
  'GET /api/invitations/:token': 'public',
  'POST /api/invitations/:token/accept': 'signed-in',
  'POST /api/invitations/:token/signup': 'public',
  'GET /api/dev/mailbox': 'signed-in',
  'GET /feeds/:file': 'public',
  'GET /api/studios/:studioId': everyone,
  'GET /api/studios/:studioId/summary': everyone,
  'PATCH /api/studios/:studioId': owners,
  'GET /api/studios/:studioId/imports': everyone,
  'POST /api/studios/:studioId/imports': planners,
  'GET /api/studios/:studioId/imports/:importId': everyone,
  'PATCH /api/studios/:studioId/imports/:importId': planners,
  'POST /api/studios/:studioId/imports/:importId/commit': planners,
  'DELETE /api/studios/:studioId/imports/:importId': planners,
  'GET /api/studios/:studioId/series': everyone,
  'GET /api/studios/:studioId/series/targets': everyone,
  'GET /api/studios/:studioId/series/:seriesId': everyone,
  'GET /api/studios/:studioId/themes': everyone,
  'POST /api/studios/:studioId/themes': planners,
  'GET /api/studios/:studioId/themes/:themeId': everyone,
  'PATCH /api/studios/:studioId/themes/:themeId': planners,
  // Partners change a theme's status, but picking one is the owner's (themes.test.ts).
  'POST /api/studios/:studioId/themes/:themeId/status': planners,
  'POST /api/studios/:studioId/themes/:themeId/pick': owners,
  'DELETE /api/studios/:studioId/themes/:themeId': owners,
  'GET /api/studios/:studioId/events': everyone,
  'GET /api/studios/:studioId/events/tray': everyone,
  'GET /api/studios/:studioId/events/at-hand': everyone,
  'GET /api/studios/:studioId/events/stamp': everyone,
  'GET /api/studios/:studioId/events/:eventId': everyone,
  // Crew may only tick their own steps done (events.test.ts); the route itself is open to them.
  'PATCH /api/studios/:studioId/events/:eventId': everyone,
  'POST /api/studios/:studioId/events/:eventId/replan': planners,
  'POST /api/studios/:studioId/runways/preview': planners,
  'GET /api/studios/:studioId/runways': everyone,
  'POST /api/studios/:studioId/runways': planners,
  'GET /api/studios/:studioId/runways/:runwayId': everyone,
  'DELETE /api/studios/:studioId/runways/:runwayId': planners,
  'GET /api/studios/:studioId/runway-templates': everyone,
  'GET /api/studios/:studioId/runway-templates/:templateId': everyone,
  'POST /api/studios/:studioId/runway-templates': planners,
  'PUT /api/studios/:studioId/runway-templates/:templateId': planners,
  'DELETE /api/studios/:studioId/runway-templates/:templateId': planners,
  'GET /api/studios/:studioId/markets': everyone,
  'GET /api/studios/:studioId/markets/:marketId': everyone,
  'POST /api/studios/:studioId/markets': planners,
  'PUT /api/studios/:studioId/markets/:marketId': planners,
  'DELETE /api/studios/:studioId/markets/:marketId': planners,
  'GET /api/studios/:studioId/occasions': everyone,
  'PUT /api/studios/:studioId/occasions': planners,
  'GET /api/studios/:studioId/occasions/upcoming': everyone,
  'GET /api/studios/:studioId/blackouts': everyone,
  'PUT /api/studios/:studioId/blackouts': planners,
  'GET /api/studios/:studioId/members': everyone,
  'PATCH /api/studios/:studioId/members/:userId': owners,
  // Removing another member is the owner's; anyone may leave, removing themselves (team.test.ts).
  'DELETE /api/studios/:studioId/members/:userId': owners,
  'GET /api/studios/:studioId/invitations': owners,
  'POST /api/studios/:studioId/invitations': owners,
  'DELETE /api/studios/:studioId/invitations/:invitationId': owners,
  'GET /api/studios/:studioId/feeds': everyone,
  'POST /api/studios/:studioId/feeds': everyone,
  // A member renews or revokes their own feed; an owner may revoke another's (feeds.test.ts).
  'POST /api/studios/:studioId/feeds/:feedId/rotate': everyone,
  'DELETE /api/studios/:studioId/feeds/:feedId': everyone,
  'POST /api/studios/:studioId/agenda/preview': everyone,
};

let t: TestApp;
beforeAll(() => {
  // Hundreds of requests from one address; the sign-in limiter has its own tests.
  t = makeTestApp({ signInLimits: { perAccount: 100, perAddress: 100_000, windowMs: 60_000 } });
});
afterAll(() => t.close());

const key = (method: string, path: string) => `${method} ${path}`;

/** The route with its studio filled in, and any other parameter a number no row has. */
function urlOf(path: string, studioId: number): string {
  return path.replace(':studioId', String(studioId)).replace(/:[A-Za-z]+/g, '987654321');
}

async function call(agent: Agent, method: string, url: string): Promise<number> {
  const verb = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  return (await agent[verb](url).send({})).status;
}

describe('the access matrix', () => {
  const routes = () => routesOf(t.app);

  it('when the app mounts a route, then this table says who may call it, and the table names no route that is gone', () => {
    const mounted = routes().map((route) => key(route.method, route.path));
    expect(mounted.filter((route) => !(route in table))).toEqual([]);
    expect(Object.keys(table).filter((route) => !mounted.includes(route))).toEqual([]);
  });

  it('when anonymous, then every route that is not public answers 401', async () => {
    const { studioId } = await makeStudio(t.db, ['owner']);
    const anonymous = await anonymousAgent(t.app);
    const answers: string[] = [];
    for (const { method, path } of routes()) {
      const status = await call(anonymous, method, urlOf(path, studioId));
      if (table[key(method, path)] === 'public' ? status === 401 : status !== 401) answers.push(`${key(method, path)} → ${status}`);
    }
    expect(answers).toEqual([]);
  });

  it('when a member of another studio calls a studio route, then 404, and a role that may not, 403', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const outsider = await signIn(t.app, (await makeStudio(t.db, ['owner'])).members.owner.email);
    const agents = { owner: await signIn(t.app, members.owner.email), partner: await signIn(t.app, members.partner.email), crew: await signIn(t.app, members.crew.email) };
    const wrong: string[] = [];
    let checks = 0;
    for (const { method, path } of routes()) {
      const access = table[key(method, path)];
      if (!Array.isArray(access)) continue;
      const url = urlOf(path, studioId);
      const foreign = await call(outsider, method, url);
      if (foreign !== 404) wrong.push(`another studio: ${key(method, path)} → ${foreign}`);
      for (const role of everyone) {
        const status = await call(agents[role], method, url);
        checks += 2;
        const isAllowed = access.includes(role);
        if (isAllowed ? status === 401 || status === 403 : status !== 403) wrong.push(`${role}: ${key(method, path)} → ${status}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(checks).toBeGreaterThan(300);
  }, 60_000);
});
