import type { AuthResponse, LoginInput, RegisterInput, User } from '@shared/auth';
import { api } from './client';

export interface ForgotPasswordInput {
  email: string;
}
export interface ResetPasswordInput {
  token: string;
  password: string;
}
export interface OkResponse {
  ok: true;
}

export const authApi = {
  register: (input: RegisterInput) => api.post<AuthResponse>('/auth/register', input),
  /** 401 here means wrong credentials: the sign-in form shows it, so no redirect. */
  login: (input: LoginInput) => api.post<AuthResponse>('/auth/login', input, { skipAuthRedirect: true }),
  me: () => api.get<{ user: User }>('/auth/me', { skipAuthRedirect: true }),
  forgotPassword: (input: ForgotPasswordInput) => api.post<OkResponse>('/auth/forgot', input, { skipAuthRedirect: true }),
  resetPassword: (input: ResetPasswordInput) => api.post<OkResponse>('/auth/reset', input, { skipAuthRedirect: true }),
};
