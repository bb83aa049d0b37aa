import { Router, type Request } from 'express';
import { invitationRequest, invitationSignupRequest, memberPatch } from '@shared/contracts/team';
import { retryAfterHeader } from '../auth/retry-after';
import { unauthenticated } from '../http/app-error';
import { allow, requireAuth, studioOf, type SessionUser } from '../http/auth-middleware';
import { idParam, parseBody } from '../http/validate';
import type { TeamService } from './team-service';

function userOf(req: Request): SessionUser {
  if (!req.user) throw unauthenticated();
  return req.user;
}

// Mounted at /api/studios/:studioId after loadStudio.
export function teamRouter(team: TeamService): Router {
  const router = Router({ mergeParams: true });

  router.get('/members', async (req, res) => {
    res.json(await team.members(studioOf(req), userOf(req)));
  });

  router.patch('/members/:userId', allow('owner'), async (req, res) => {
    res.json(await team.changeRole(studioOf(req), userOf(req), idParam(req, 'userId'), parseBody(memberPatch, req)));
  });

  // Owners remove anyone; every member may remove themselves (the service decides).
  router.delete('/members/:userId', async (req, res) => {
    await team.remove(studioOf(req), userOf(req), idParam(req, 'userId'));
    res.status(204).end();
  });

  router.get('/invitations', allow('owner'), async (req, res) => {
    res.json(await team.pending(studioOf(req)));
  });

  router.post('/invitations', allow('owner'), async (req, res) => {
    res.status(201).json(await team.invite(studioOf(req), userOf(req), parseBody(invitationRequest, req)));
  });

  router.delete('/invitations/:invitationId', allow('owner'), async (req, res) => {
    await team.revoke(studioOf(req), idParam(req, 'invitationId'));
    res.status(204).end();
  });

  router.use(retryAfterHeader);
  return router;
}

// Mounted at /api/invitations: the invitee's side, reached from the link in the e-mail.
export function invitationRouter(team: TeamService): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await team.preview(String(req.params['token'])));
  });

  router.post('/:token/accept', requireAuth, async (req, res) => {
    res.json(await team.accept(String(req.params['token']), userOf(req)));
  });

  router.post('/:token/signup', async (req, res) => {
    const { name, password } = parseBody(invitationSignupRequest, req);
    const { user, accepted } = await team.signUpAndAccept(String(req.params['token']), name, password);
    // passport 0.7 regenerates the session id on login (no session fixation).
    await new Promise<void>((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
    res.status(201).json(accepted);
  });

  return router;
}
