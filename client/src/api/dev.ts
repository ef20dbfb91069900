import { api } from './client';

/** One message caught by the project's own SMTP server (development and tests only). */
export interface DevMail {
  id: string | number;
  to: string[] | string;
  subject: string;
  text: string;
  html: string | false | null;
  date: string;
}

/** The dev mailbox; the API answers 404 in production, where it does not exist. */
export const devApi = {
  mail: (signal?: AbortSignal) => api.get<{ items: DevMail[]; total: number }>('/dev/mail', { signal, skipAuthRedirect: true }),
};
