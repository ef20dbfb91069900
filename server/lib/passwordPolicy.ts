import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';
import { AppError } from './AppError';

/**
 * Password strength, beside the length rule in shared/auth.ts: zxcvbn's estimate (Wheeler, "zxcvbn: Low-Budget
 * Password Strength Estimation", USENIX Security 2016) against its lists of common passwords, words and names,
 * keyboard walks and sequences, and the user's own e-mail and name. Score 3 and up ("safely unguessable",
 * about 10^8 guesses or more) passes — checking new passwords against lists of commonly used and compromised
 * values and the user's context is NIST SP 800-63B §5.1.1.2.
 */
export const MIN_PASSWORD_SCORE = 3;

let factory: ZxcvbnFactory | null = null;
function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return factory;
}

/** The user's own words the password may not be built from: the e-mail, its local part and domain labels, and each word of the name. */
function userWords(email: string, displayName: string): string[] {
  const [local = '', domain = ''] = email.toLowerCase().split('@');
  const words = [
    email.toLowerCase(),
    local,
    ...local.split(/[^a-z0-9]+/),
    ...domain.split('.').filter((d) => d.length > 3),
    displayName.toLowerCase(),
    ...displayName.toLowerCase().split(/[^\p{L}\p{N}]+/u),
  ];
  return [...new Set(words.filter((w) => w.length >= 3))];
}

/** Throws a 400 with a field message when the password is too easy to guess for this user. */
export function assertStrongPassword(password: string, user: { email: string; displayName: string }, field = 'body.password'): void {
  const r = estimator().check(password, userWords(user.email, user.displayName));
  if (r.score >= MIN_PASSWORD_SCORE) return;
  const usesOwn = r.sequence.some((m) => 'dictionaryName' in m && m.dictionaryName === 'userInputs');
  const hint = usesOwn
    ? 'It is built from your own e-mail or name.'
    : (r.feedback.warning ?? 'It is a common password or an easy pattern.');
  throw new AppError(400, 'weak_password', 'Choose a password that is harder to guess', {
    [field]: `Too easy to guess. ${hint} Use several unrelated words or a password manager.`.replace(/\s+/g, ' ').trim(),
  });
}
