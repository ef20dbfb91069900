import { Router } from 'express';
import { ForgotSchema, LoginSchema, RegisterSchema, ResetSchema, VerifyEmailSchema } from '../../../shared/auth';
import { requireAuth } from '../../middleware/auth';
import { authRateLimit, signupRateLimit } from '../../middleware/rateLimit';
import { validate } from '../../middleware/validate';
import { authController } from './auth.controller';

export const authRouter = Router();

authRouter.post('/register', signupRateLimit, validate({ body: RegisterSchema }), authController.register);
authRouter.post('/login', authRateLimit, validate({ body: LoginSchema }), authController.login);
authRouter.get('/me', requireAuth, authController.me);
authRouter.post('/forgot', signupRateLimit, validate({ body: ForgotSchema }), authController.forgot);
authRouter.post('/reset', authRateLimit, validate({ body: ResetSchema }), authController.reset);
// The mailed token is the credential (tries with wrong tokens count like failed sign-ins).
authRouter.post('/verify-email', authRateLimit, validate({ body: VerifyEmailSchema }), authController.verifyEmail);
// A new verification link for the signed-in user; each request sends a mail, so it is limited like sign-ups.
authRouter.post('/verify-email/send', requireAuth, signupRateLimit, authController.resendVerification);
