import type { AuthResponse, ForgotInput, LoginInput, RegisterInput, ResetInput, User } from '@shared/auth';
import { api } from './client';

export interface OkResponse {
  ok: true;
}

export const authApi = {
  register: (input: RegisterInput) => api.post<AuthResponse>('/auth/register', input),
  /** 401 here means wrong credentials: the sign-in form shows it, so no redirect. */
  login: (input: LoginInput) => api.post<AuthResponse>('/auth/login', input, { skipAuthRedirect: true }),
  me: () => api.get<{ user: User }>('/auth/me', { skipAuthRedirect: true }),
  forgotPassword: (input: ForgotInput) => api.post<OkResponse>('/auth/forgot', input, { skipAuthRedirect: true }),
  resetPassword: (input: ResetInput) => api.post<OkResponse>('/auth/reset', input, { skipAuthRedirect: true }),
};
