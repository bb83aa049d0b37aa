import request from 'supertest';
import { hashToken } from '../../server/account/tokens';
import { anonymousAgent, makeStudio, signIn, testPassword, uniqueEmail } from '../helpers/test-app';
import { linkToken, makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';
import { appClock, fixedClock, useClock } from '../../server/clock/clock';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

async function invite(studioId: number, ownerEmail: string, email: string, role: string) {
  const owner = await signIn(t.app, ownerEmail);
  const response = await owner.post(`/api/studios/${studioId}/invitations`).send({ email, role });
  expect(response.status).toBe(201);
  const mail = await waitForMail(t.db, email, /invites you/);
  return { owner, response, mail, token: linkToken(mail, '/invitations') };
}

describe('members', () => {
  it('when a crew member lists members, then everyone comes back with roles, owners first', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    const response = await crew.get(`/api/studios/${studioId}/members`);
    expect(response.status).toBe(200);
    expect(response.body.map((m: { role: string }) => m.role)).toEqual(['owner', 'partner', 'crew']);
    expect(response.body[2]).toMatchObject({ userId: members.crew.id, email: members.crew.email, isYou: true });
  });

  it('when the owner changes a role, then it is stored', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.patch(`/api/studios/${studioId}/members/${members.crew.id}`).send({ role: 'partner' });
    expect(response.status).toBe(200);
    expect((await t.db('memberships').where({ studio_id: studioId, user_id: members.crew.id }).first()).role).toBe('partner');
  });

  it('when the only owner demotes or removes themselves, then 409 says why and nothing changes', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const demote = await owner.patch(`/api/studios/${studioId}/members/${members.owner.id}`).send({ role: 'crew' });
    expect(demote.status).toBe(409);
    expect(demote.body.error).toMatchObject({ code: 'last_owner', message: expect.stringContaining("only owner") });
    const leave = await owner.delete(`/api/studios/${studioId}/members/${members.owner.id}`);
    expect(leave.status).toBe(409);
    expect((await t.db('memberships').where({ studio_id: studioId, user_id: members.owner.id }).first()).role).toBe('owner');
  });

  it('when there is a second owner, then the first may step down and leave', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.patch(`/api/studios/${studioId}/members/${members.partner.id}`).send({ role: 'owner' })).status).toBe(200);
    expect((await owner.patch(`/api/studios/${studioId}/members/${members.owner.id}`).send({ role: 'partner' })).status).toBe(200);
    expect((await owner.delete(`/api/studios/${studioId}/members/${members.owner.id}`)).status).toBe(204);
    expect(await t.db('memberships').where({ studio_id: studioId, user_id: members.owner.id }).first()).toBeUndefined();
    expect((await owner.get(`/api/studios/${studioId}`)).status).toBe(404);
  });

  it('when the owner removes a member, then the membership and their feeds of this studio are gone at once', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const other = await makeStudio(t.db, ['owner']);
    await t.db('memberships').insert({ studio_id: other.studioId, user_id: members.crew.id, role: 'crew' });
    await t.db('feeds').insert([
      { studio_id: studioId, user_id: members.crew.id, scope: 'mine', token_hash: hashToken(`a-${studioId}`) },
      { studio_id: other.studioId, user_id: members.crew.id, scope: 'all', token_hash: hashToken(`b-${studioId}`) },
    ]);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.delete(`/api/studios/${studioId}/members/${members.crew.id}`)).status).toBe(204);
    expect(await t.db('feeds').where({ user_id: members.crew.id }).pluck('studio_id')).toEqual([other.studioId]);
    expect((await owner.delete(`/api/studios/${studioId}/members/${members.crew.id}`)).status).toBe(404);
  });

  it('when crew leaves, then 204; when crew removes someone else, then 403', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    expect((await crew.delete(`/api/studios/${studioId}/members/${members.partner.id}`)).status).toBe(403);
    expect((await crew.delete(`/api/studios/${studioId}/members/${members.crew.id}`)).status).toBe(204);
  });

  it('when the role is not one of ours, then 400 names role', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.patch(`/api/studios/${studioId}/members/${members.crew.id}`).send({ role: 'boss' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(['role']);
  });
});

describe('invitations', () => {
  it.each(['owner', 'partner', 'crew'] as const)('when the owner invites an existing account as %s, then a two-part mail links to an invitation that joins them', async (role) => {
    const { studioId, members } = await makeStudio(t.db, ['owner'], 'Birch Row Studio');
    const guest = await makeStudio(t.db, ['owner']);
    const { response, mail, token } = await invite(studioId, members.owner.email, guest.members.owner.email, role);
    expect(response.body).toMatchObject({ email: guest.members.owner.email, role, invitedBy: 'owner person' });
    // Parsed by mailparser in the fake: subject, recipient, both parts.
    expect(mail.subject).toBe('owner person invites you to Birch Row Studio on Kerfcast');
    expect(mail.to).toBe(guest.members.owner.email);
    expect(mail.text).toContain(`http://app.example.test/invitations/${token}`);
    expect(mail.html).toContain(`href="http://app.example.test/invitations/${token}"`);
    expect(mail.html).not.toMatch(/<img|src=/);
    expect(token.length).toBeGreaterThanOrEqual(22);
    const stored = await t.db('invitations').where({ id: response.body.id }).first();
    expect(stored.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(stored)).not.toContain(token);
    const expiresInDays = (new Date(stored.expires_at).getTime() - appClock.now().getTime()) / 86_400_000;
    expect(expiresInDays).toBeGreaterThan(6.99);
    expect(expiresInDays).toBeLessThanOrEqual(7);

    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.body).toMatchObject({ studioName: 'Birch Row Studio', role, email: guest.members.owner.email, hasAccount: true });
    const invitee = await signIn(t.app, guest.members.owner.email);
    const accepted = await invitee.post(`/api/invitations/${token}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ studioId, studioName: 'Birch Row Studio', role });
    expect((await t.db('memberships').where({ studio_id: studioId, user_id: guest.members.owner.id }).first()).role).toBe(role);
    expect((await invitee.get(`/api/studios/${studioId}`)).body.role).toBe(role);
  });

  it('when an invitation is used twice, then the second time answers 410', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const guest = await makeStudio(t.db, ['owner']);
    const { token } = await invite(studioId, members.owner.email, guest.members.owner.email, 'crew');
    const invitee = await signIn(t.app, guest.members.owner.email);
    expect((await invitee.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    const again = await invitee.post(`/api/invitations/${token}/accept`);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(410);
  });

  it('when an invitation is past its 7 days, then preview and accept answer 410 and nobody joins', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const guest = await makeStudio(t.db, ['owner']);
    const { token, response } = await invite(studioId, members.owner.email, guest.members.owner.email, 'partner');
    await t.db('invitations').where({ id: response.body.id }).update({ expires_at: new Date(appClock.now().getTime() - 1000) });
    expect((await request(t.app).get(`/api/invitations/${token}`)).body.error.code).toBe('invitation_expired');
    const invitee = await signIn(t.app, guest.members.owner.email);
    expect((await invitee.post(`/api/invitations/${token}/accept`)).status).toBe(410);
    expect(await t.db('memberships').where({ studio_id: studioId, user_id: guest.members.owner.id }).first()).toBeUndefined();
  });

  it('when someone signed in as another address accepts, then 403 names both addresses and nobody joins', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const intended = uniqueEmail('intended');
    const stranger = await makeStudio(t.db, ['owner']);
    const { token } = await invite(studioId, members.owner.email, intended, 'partner');
    const agent = await signIn(t.app, stranger.members.owner.email);
    const response = await agent.post(`/api/invitations/${token}/accept`);
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('invitation_other_address');
    expect(response.body.error.message).toContain(intended);
    expect(response.body.error.message).toContain(stranger.members.owner.email);
    expect(await t.db('memberships').where({ studio_id: studioId, user_id: stranger.members.owner.id }).first()).toBeUndefined();
    // Still usable by the right person.
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(200);
  });

  it('when the invitee has no account, then they sign up through the invitation and are signed in as a member', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner'], 'Hollow Oak Bench');
    const email = uniqueEmail('newcomer');
    const { token } = await invite(studioId, members.owner.email, email, 'crew');
    expect((await request(t.app).get(`/api/invitations/${token}`)).body.hasAccount).toBe(false);
    const agent = await anonymousAgent(t.app);
    const short = await agent.post(`/api/invitations/${token}/signup`).send({ name: 'New Person', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.issues[0].path).toEqual(['password']);
    const response = await agent.post(`/api/invitations/${token}/signup`).send({ name: 'New Person', password: testPassword });
    expect(response.status).toBe(201);
    expect(response.body).toEqual({ studioId, studioName: 'Hollow Oak Bench', role: 'crew' });
    const me = await agent.get('/api/auth/me');
    expect(me.body).toMatchObject({ user: { email, name: 'New Person' }, studios: [{ id: studioId, role: 'crew' }] });
    expect((await agent.post(`/api/invitations/${token}/signup`).send({ name: 'Again', password: testPassword })).status).toBe(410);
  });

  it.each([
    ['password12', 'This is a commonly used password.'],
    ['hollowoakbench', 'There should not be any personal or page related data.'],
  ])('when the invitee signs up with the password %j, then 400 names the password field and no account is made', async (password, reason) => {
    const { studioId, members } = await makeStudio(t.db, ['owner'], 'Hollow Oak Bench');
    const email = uniqueEmail('weak-invitee');
    const { token } = await invite(studioId, members.owner.email, email, 'crew');
    const response = await (await anonymousAgent(t.app)).post(`/api/invitations/${token}/signup`).send({ name: 'Tamsel Orrin', password });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: ['password'], message: expect.stringContaining(reason) }]);
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(200);
  });

  it('when the invitee\'s name has a text-direction override, then 400 names the name field and no account is made', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const email = uniqueEmail('bidi-invitee');
    const { token } = await invite(studioId, members.owner.email, email, 'crew');
    const response = await (await anonymousAgent(t.app)).post(`/api/invitations/${token}/signup`).send({ name: 'Tamsel\u202eOrrin', password: testPassword });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: ['name'], message: 'Name contains a control or text-direction character' }]);
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
  });

  it('when the owner lists and revokes a pending invitation, then its link stops working', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const email = uniqueEmail('pending');
    const { owner, token, response } = await invite(studioId, members.owner.email, email, 'crew');
    const list = await owner.get(`/api/studios/${studioId}/invitations`);
    expect(list.body).toEqual([expect.objectContaining({ id: response.body.id, email, role: 'crew' })]);
    expect((await owner.delete(`/api/studios/${studioId}/invitations/${response.body.id}`)).status).toBe(204);
    expect((await owner.get(`/api/studios/${studioId}/invitations`)).body).toEqual([]);
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
    expect((await owner.delete(`/api/studios/${studioId}/invitations/${response.body.id}`)).status).toBe(404);
  });

  it('when the same address is invited again, then only the newer link works', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const email = uniqueEmail('twice');
    const first = await invite(studioId, members.owner.email, email, 'crew');
    const owner = first.owner;
    await owner.post(`/api/studios/${studioId}/invitations`).send({ email, role: 'partner' });
    expect((await request(t.app).get(`/api/invitations/${first.token}`)).status).toBe(404);
    const pending = await owner.get(`/api/studios/${studioId}/invitations`);
    expect(pending.body.map((invitation: { role: string }) => invitation.role)).toEqual(['partner']);
  });

  it.each([
    [{ email: 'not-an-address', role: 'crew' }, 'email'],
    [{ email: 'a@example.test', role: 'boss' }, 'role'],
    [{ role: 'crew' }, 'email'],
  ])('when the invitation is %j, then 400 names %s and nothing is stored', async (body, field) => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.post(`/api/studios/${studioId}/invitations`).send(body);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual([field]);
    expect(await t.db('invitations').where({ studio_id: studioId })).toEqual([]);
  });

  it('when the address is already a member, then 409', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner', 'crew']);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.post(`/api/studios/${studioId}/invitations`).send({ email: members.crew.email.toUpperCase(), role: 'partner' });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('already_member');
  });

  it('when the token is unknown, then 404; accepting while signed out is 401', async () => {
    expect((await request(t.app).get('/api/invitations/nothing-like-a-token')).status).toBe(404);
    const agent = await anonymousAgent(t.app);
    expect((await agent.post('/api/invitations/nothing-like-a-token/accept')).status).toBe(401);
  });
});

describe('access to team routes', () => {
  const routes = [
    ['get', '/members'],
    ['patch', '/members/1'],
    ['delete', '/members/1'],
    ['get', '/invitations'],
    ['post', '/invitations'],
    ['delete', '/invitations/1'],
  ] as const;

  it.each(routes)('when anonymous, then %s %s answers 401', async (method, path) => {
    const { studioId } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    expect((await agent[method](`/api/studios/${studioId}${path}`).send({})).status).toBe(401);
  });

  it.each(routes)('when a member of another studio calls %s %s, then 404', async (method, path) => {
    const { studioId } = await makeStudio(t.db, ['owner']);
    const other = await makeStudio(t.db, ['owner']);
    const agent = await signIn(t.app, other.members.owner.email);
    expect((await agent[method](`/api/studios/${studioId}${path}`).send({ email: 'x@example.test', role: 'crew' })).status).toBe(404);
  });

  it.each(['partner', 'crew'] as const)('when a %s manages members or invitations, then 403 and nothing changes', async (role) => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members[role].email);
    expect((await agent.patch(`/api/studios/${studioId}/members/${members.owner.id}`).send({ role: 'crew' })).status).toBe(403);
    expect((await agent.delete(`/api/studios/${studioId}/members/${members.owner.id}`)).status).toBe(403);
    expect((await agent.get(`/api/studios/${studioId}/invitations`)).status).toBe(403);
    expect((await agent.post(`/api/studios/${studioId}/invitations`).send({ email: uniqueEmail('x'), role: 'owner' })).status).toBe(403);
    expect((await agent.delete(`/api/studios/${studioId}/invitations/1`)).status).toBe(403);
    expect(await t.db('invitations').where({ studio_id: studioId })).toEqual([]);
    expect((await t.db('memberships').where({ studio_id: studioId, user_id: members.owner.id }).first()).role).toBe('owner');
  });
});
