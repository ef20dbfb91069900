import { z } from 'zod';
import {
  AuthResponseSchema,
  ForgotSchema,
  LoginSchema,
  RegisterResponseSchema,
  RegisterSchema,
  ResetSchema,
  UserSchema,
  VerifyEmailSchema,
} from '../../../shared/auth';
import { OkSchema } from '../../../shared/api';
import { runInBackground } from '../../lib/background';
import { authRateLimit, signupRateLimit } from '../../middleware/rateLimit';
import { route, type RouteGroup } from '../../http/route';
import { authService } from './auth.service';

/** Sign-up, sign-in, the password reset and the e-mail verification. */
export const authRoutes: RouteGroup = {
  prefix: '/auth',
  routes: [
    route({
      method: 'post',
      path: '/register',
      status: 201,
      access: 'public',
      before: [signupRateLimit],
      summary:
        'Create a bowler account and mail a verification link (the same answer whether the address is new or taken; the mail says which)',
      body: RegisterSchema,
      response: RegisterResponseSchema,
      handler: ({ body }) => authService.register(body),
    }),
    route({
      method: 'post',
      path: '/login',
      summary: 'Sign in: a bearer token and the user',
      access: 'public',
      before: [authRateLimit],
      body: LoginSchema,
      response: AuthResponseSchema,
      handler: ({ body }) => authService.login(body),
    }),
    route({
      method: 'get',
      path: '/me',
      summary: 'The signed-in user with their role',
      access: 'signed-in',
      response: z.object({ user: UserSchema }),
      handler: async ({ user }) => ({ user: await authService.me(user.id) }),
    }),
    route({
      method: 'post',
      path: '/forgot',
      status: 202,
      access: 'public',
      before: [signupRateLimit],
      summary: 'Mail a password-reset link (answers at once and the same for unknown e-mails; a new link closes the older one)',
      body: ForgotSchema,
      response: OkSchema,
      // Answers at once, the same for every address; the lookup and the mail happen after the answer.
      handler: ({ body }) => {
        runInBackground('password reset mail', () => authService.sendReset(body.email));
        return { ok: true as const };
      },
    }),
    route({
      method: 'post',
      path: '/reset',
      access: 'public',
      before: [authRateLimit],
      summary: 'Set a new password from a reset token (every reset link and session of the user ends)',
      body: ResetSchema,
      response: OkSchema,
      handler: async ({ body }) => {
        await authService.reset(body.token, body.password);
        return { ok: true as const };
      },
    }),
    // The mailed token is the credential (tries with wrong tokens count like failed sign-ins).
    route({
      method: 'post',
      path: '/verify-email',
      summary: 'Confirm the e-mail address from the mailed verification token',
      access: 'public',
      before: [authRateLimit],
      body: VerifyEmailSchema,
      response: z.object({ ok: z.literal(true), user: UserSchema }),
      handler: async ({ body }) => ({ ok: true as const, user: await authService.verifyEmail(body.token) }),
    }),
    // Each request sends a mail, so it is limited like sign-ups.
    route({
      method: 'post',
      path: '/verify-email/send',
      status: 202,
      access: 'signed-in',
      before: [signupRateLimit],
      summary: 'Mail a new verification link to the signed-in user (the older one stops working)',
      response: z.object({ ok: z.literal(true), alreadyVerified: z.boolean() }),
      handler: ({ user }) => authService.resendVerification(user.id),
    }),
  ],
};
