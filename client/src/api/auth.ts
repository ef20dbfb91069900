import type {
  AuthResponse,
  ForgotInput,
  LoginInput,
  RegisterInput,
  RegisterResponse,
  ResetInput,
  User,
  VerifyEmailInput,
} from '@shared/auth';
import type { Ok } from '@shared/api';
import { api } from './client';

export type OkResponse = Ok;

export const authApi = {
  /** The same answer for a new or a taken address; the mail tells the owner what happened. */
  register: (input: RegisterInput) => api.post<RegisterResponse>('/auth/register', input),
  /** 401 here means wrong credentials: the sign-in form shows it, so no redirect. */
  login: (input: LoginInput) => api.post<AuthResponse>('/auth/login', input, { skipAuthRedirect: true }),
  me: () => api.get<{ user: User }>('/auth/me', { skipAuthRedirect: true }),
  forgotPassword: (input: ForgotInput) => api.post<OkResponse>('/auth/forgot', input, { skipAuthRedirect: true }),
  resetPassword: (input: ResetInput) => api.post<OkResponse>('/auth/reset', input, { skipAuthRedirect: true }),
  verifyEmail: (input: VerifyEmailInput) => api.post<{ ok: true; user: User }>('/auth/verify-email', input, { skipAuthRedirect: true }),
  resendVerification: () => api.post<{ ok: true; alreadyVerified: boolean }>('/auth/verify-email/send', {}),
};
