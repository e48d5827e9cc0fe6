import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import {
  ChangePasswordInput,
  ResetConfirmInput,
  ResetRequestInput,
  SignInInput,
  SignUpInput,
  UpdateMeInput,
  type MeResponse,
  type OkResponse,
  type SessionResponse,
} from '../../shared/schemas/auth';
import type { Config } from '../config';
import { authRateLimit, signInRateLimit } from '../http/rate-limit';
import { requireUser, setSessionCookie } from '../http/session';
import type { Services } from '../services';

export function authRouter({ auth, invites, rateLimits }: Services, config: Config) {
  const router = Router();
  const me = async (userId: string): Promise<MeResponse> => ({ user: await auth.me(userId) });

  router.post(
    paths.signUp,
    authRateLimit(config, rateLimits.store('sign-up')),
    async (req, res) => {
      const input = SignUpInput.parse(req.body);
      const token = input.inviteToken;
      // Check the invite first (a bad link costs no password hashing), then spend it in the
      // transaction that creates the account.
      if (token) await invites.preview(token);
      const userId = await auth.signUp(
        input,
        token ? (em, id) => invites.spend(em, id, token).then(() => undefined) : undefined,
      );
      setSessionCookie(auth.lucia, req, res, await auth.createSession(userId));
      res.status(201).json(await me(userId));
    },
  );

  router.post(
    paths.signIn,
    signInRateLimit(config, rateLimits.store('sign-in')),
    async (req, res) => {
      const userId = await auth.signIn(SignInInput.parse(req.body));
      setSessionCookie(auth.lucia, req, res, await auth.createSession(userId));
      res.json(await me(userId));
    },
  );

  router.post(paths.signOut, async (req, res) => {
    if (req.auth) await auth.signOut(req.auth.session.id);
    setSessionCookie(auth.lucia, req, res, null);
    const body: OkResponse = { ok: true };
    res.json(body);
  });

  // Nobody signed in is an ordinary answer here, not a 401: the app asks on every start, and a
  // signed-out visit should leave no error in the browser's console.
  router.get(paths.me, async (req, res) => {
    const body: SessionResponse = req.auth ? await me(req.auth.user.id) : { user: null };
    res.set('cache-control', 'no-store').json(body);
  });

  router.patch(paths.me, async (req, res) => {
    const user = requireUser(req);
    res.json({
      user: await auth.updateMe(user.id, UpdateMeInput.parse(req.body)),
    } satisfies MeResponse);
  });

  /** Changing the password ends every session, then signs this device back in. */
  router.post(
    paths.password,
    authRateLimit(config, rateLimits.store('password')),
    async (req, res) => {
      const user = requireUser(req);
      await auth.changePassword(user.id, ChangePasswordInput.parse(req.body));
      setSessionCookie(auth.lucia, req, res, await auth.createSession(user.id));
      res.json(await me(user.id));
    },
  );

  router.post(
    paths.resetRequest,
    authRateLimit(config, rateLimits.store('reset-request')),
    async (req, res) => {
      await auth.requestReset(ResetRequestInput.parse(req.body).email);
      const body: OkResponse = {
        ok: true,
        message: 'If an account uses this address, a reset link is on its way.',
      };
      res.status(202).json(body);
    },
  );

  router.post(
    paths.resetConfirm,
    authRateLimit(config, rateLimits.store('reset-confirm')),
    async (req, res) => {
      const userId = await auth.confirmReset(ResetConfirmInput.parse(req.body));
      setSessionCookie(auth.lucia, req, res, await auth.createSession(userId));
      res.json(await me(userId));
    },
  );

  return router;
}
