import crypto from 'node:crypto';
import fs from 'node:fs';
import nodePath from 'node:path';

/** The payment fake's records and shared pieces: types, errors, ids, and the stores (kept in a file in development). */

export type Obj = Record<string, unknown>;

export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: Obj };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface FakeDelivery {
  eventId: string;
  type: string;
  attempt: number;
  status: number | null;
  error: string | null;
  at: string;
}

export interface StripeFakeOptions {
  /** 0 = a free port. */
  port?: number;
  host?: string;
  /** The signing secret the receiver verifies with (whsec_…). */
  webhookSecret: string;
  /** The one secret key the fake accepts (sk_test_…); unset = any sk_test_ key. */
  apiKey?: string;
  /** Where events are POSTed; null keeps them (readable in `events`) without delivering. */
  webhookUrl?: string | null;
  /** Delays between delivery attempts of one event (the real service retries for days; here seconds). */
  retryDelaysMs?: number[];
  /** Max wait for the first delivery of a completion before the browser is redirected (ms). */
  redirectWaitMs?: number;
  /** Keeps sessions, payments and refunds in this JSON file across restarts (development). */
  stateFile?: string;
}

/** The running fake, as its starter sees it. */
export interface StripeFake {
  url: string;
  port: number;
  host: string;
  setWebhookUrl(url: string | null): void;
  readonly events: FakeEvent[];
  readonly deliveries: FakeDelivery[];
  /** Resolves when no delivery is pending or waiting for a retry. */
  idle(): Promise<void>;
  close(): Promise<void>;
}

export const API_VERSION = '2026-10-28.endive';

/** An error answer of the fake's API, in the real service's shape. */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly body: { type: string; code?: string; message: string; param?: string; decline_code?: string },
  ) {
    super(body.message);
  }
}

/** The service's 404 for an unknown object: `No such <what>: '<id>'`, naming the parameter that carried the id. */
export const missing = (what: string, id: string, param: string) =>
  new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such ${what}: '${id}'`, param });

export const now = () => Math.floor(Date.now() / 1000);
export const newId = (prefix: string) => `${prefix}_test_${crypto.randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;

/** What a checkout shows on its hosted page and passes to its payment (not part of the real session object). */
export interface SessionExtra {
  productName: string;
  intentMetadata: Record<string, string>;
  description: string | null;
}

/** Checkout sessions, payments, charges and refunds, by id; with a state file, kept across restarts. */
export class FakeState {
  readonly sessions = new Map<string, Obj>();
  readonly intents = new Map<string, Obj>();
  readonly charges = new Map<string, Obj>();
  readonly refunds = new Map<string, Obj>();
  readonly sessionExtras = new Map<string, SessionExtra>();
  /** Answers by idempotency key (per secret key and path). */
  readonly idempotent = new Map<string, { status: number; body: string }>();
  /** The fake's own address, once it listens (hosted page links). */
  base = '';

  constructor(private readonly stateFile?: string) {
    this.load();
  }

  private get stores() {
    return {
      sessions: this.sessions,
      intents: this.intents,
      charges: this.charges,
      refunds: this.refunds,
      sessionExtras: this.sessionExtras,
    } as const;
  }

  private load(): void {
    if (!this.stateFile || !fs.existsSync(this.stateFile)) return;
    try {
      const saved = JSON.parse(fs.readFileSync(this.stateFile, 'utf8')) as Record<string, [string, never][]>;
      for (const [name, map] of Object.entries(this.stores))
        for (const [k, v] of saved[name] ?? []) (map as Map<string, unknown>).set(k, v);
    } catch {
      // An unreadable state file starts the fake empty.
    }
  }

  save(): void {
    if (!this.stateFile) return;
    const out = Object.fromEntries(Object.entries(this.stores).map(([name, map]) => [name, [...(map as Map<string, unknown>).entries()]]));
    fs.mkdirSync(nodePath.dirname(this.stateFile), { recursive: true });
    fs.writeFileSync(`${this.stateFile}.tmp`, JSON.stringify(out));
    fs.renameSync(`${this.stateFile}.tmp`, this.stateFile);
  }

  sessionOr404(id: string): Obj {
    const s = this.sessions.get(id);
    if (!s) throw missing('checkout.session', id, 'id');
    return s;
  }
}
