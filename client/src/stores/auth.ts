import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { LoginInput, RegisterInput, Role, User } from '@shared/auth';
import { authApi } from '@/api/auth';
import { isApiRequestError } from '@/api/client';

export const TOKEN_STORAGE_KEY = 'lanewright.token';

function readStoredToken(): string | null {
  try {
    return window.localStorage.getItem(TOKEN_STORAGE_KEY);
  } catch {
    return null;
  }
}

function writeStoredToken(token: string | null): void {
  try {
    if (token) window.localStorage.setItem(TOKEN_STORAGE_KEY, token);
    else window.localStorage.removeItem(TOKEN_STORAGE_KEY);
  } catch {
    // Storage may be unavailable (private mode); the session then lasts for this tab only.
  }
}

/** The signed-in user and their token. The token lives here and in localStorage (`lanewright.token`). */
export const useAuthStore = defineStore('auth', () => {
  const token = ref<string | null>(readStoredToken());
  const user = ref<User | null>(null);
  /** Set when the session could not be checked for a reason other than 401 (e.g. the API is down). */
  const sessionError = ref<string | null>(null);
  let pendingCheck: Promise<void> | null = null;

  const isSignedIn = computed(() => token.value !== null && user.value !== null);
  const role = computed<Role | null>(() => user.value?.role ?? null);

  function setSession(nextToken: string, nextUser: User): void {
    token.value = nextToken;
    user.value = nextUser;
    sessionError.value = null;
    writeStoredToken(nextToken);
  }

  /** Forget the session locally (sign-out, or the server answered 401). */
  function clearSession(): void {
    token.value = null;
    user.value = null;
    writeStoredToken(null);
  }

  async function signIn(input: LoginInput): Promise<User> {
    const res = await authApi.login(input);
    setSession(res.token, res.user);
    return res.user;
  }

  /**
   * Sign-up answers the same whether the address was new or taken, so the client then signs in with what was
   * typed: that works for a new account; for a taken address it fails and the form points to the mail.
   */
  async function signUp(input: RegisterInput): Promise<{ user: User | null; message: string }> {
    const res = await authApi.register(input);
    try {
      return { user: await signIn({ email: input.email, password: input.password }), message: res.message };
    } catch (err) {
      if (isApiRequestError(err) && (err.status === 401 || err.status === 429)) return { user: null, message: res.message };
      throw err;
    }
  }

  /** After the verification link was followed in this browser. */
  function markVerified(): void {
    if (user.value) user.value = { ...user.value, emailVerified: true };
  }

  function signOut(): void {
    clearSession();
  }

  /** Load the user behind a stored token once (the router guard awaits this before every navigation). */
  async function ensureSession(): Promise<void> {
    if (!token.value || user.value) return;
    if (!pendingCheck) {
      pendingCheck = (async () => {
        try {
          const res = await authApi.me();
          user.value = res.user;
          sessionError.value = null;
        } catch (err) {
          if (isApiRequestError(err) && err.status === 401) clearSession();
          else sessionError.value = isApiRequestError(err) ? err.message : 'Your session could not be checked.';
        } finally {
          pendingCheck = null;
        }
      })();
    }
    await pendingCheck;
  }

  function hasRole(roles: readonly Role[] | undefined): boolean {
    if (!roles || roles.length === 0) return true;
    const held = user.value?.roles?.length ? user.value.roles : role.value ? [role.value] : [];
    return roles.some((r) => held.includes(r));
  }

  return {
    token,
    user,
    sessionError,
    isSignedIn,
    role,
    setSession,
    clearSession,
    signIn,
    signUp,
    markVerified,
    signOut,
    ensureSession,
    hasRole,
  };
});
