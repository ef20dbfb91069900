import { config } from '../config/index';

/**
 * The one base of every link the server writes (reset and verification mails, coaching and order mails,
 * checkout return pages). It comes from configuration only — never from a request's Host or
 * X-Forwarded-* headers, which the sender controls (OWASP, "Forgot Password Cheat Sheet": host header
 * poisoning of reset links).
 *
 * PUBLIC_URL when set (required in production); otherwise (development, tests) the server's own
 * configured loopback address and the port it listens on.
 */
let listeningPort: number | null = null;

/** index.ts reports the bound port (PORT=0 picks a free one). */
export function setListeningPort(port: number | null): void {
  listeningPort = port;
}

export function publicUrl(): string {
  if (config.PUBLIC_URL) return config.PUBLIC_URL;
  const host = ['0.0.0.0', '::', ''].includes(config.HOST) ? '127.0.0.1' : config.HOST.includes(':') ? `[${config.HOST}]` : config.HOST;
  return `http://${host}:${listeningPort ?? config.PORT}`;
}

/** An absolute link to a path of the client (`/reset-password?token=…`). */
export function linkTo(pathAndQuery: string): string {
  return `${publicUrl()}${pathAndQuery.startsWith('/') ? '' : '/'}${pathAndQuery}`;
}
