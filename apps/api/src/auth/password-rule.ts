import type { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { invalidField } from '../errors.ts';

/** zxcvbn's score (0–4) a new password must reach: 3 is "safely unguessable" to an offline attack at a slow hash. */
const MIN_SCORE = 3;

let estimator: Promise<ZxcvbnFactory> | null = null;
/**
 * Loaded and built on first use: the dictionaries take a few hundred milliseconds and about 30 MB,
 * which a process that never sets a password (most of them, most days) should not carry.
 */
async function estimate(password: string, userInputs: string[]) {
  estimator ??= Promise.all([import('@zxcvbn-ts/core'), import('@zxcvbn-ts/language-common'), import('@zxcvbn-ts/language-en')]).then(
    ([core, common, en]) =>
      new core.default.ZxcvbnFactory({
        translations: en.default.translations,
        graphs: common.default.adjacencyGraphs,
        dictionary: { ...common.default.dictionary, ...en.default.dictionary },
      }),
  );
  return (await estimator).check(password, userInputs);
}

/** The person's name and e-mail in the pieces a password might borrow (4 letters or more: shorter ones turn up inside ordinary words). */
function personalWords(person: { email: string; name: string }): string[] {
  const local = person.email.toLowerCase().split('@')[0] ?? '';
  const pieces = [local, ...local.split(/[^\p{L}\p{N}]+/u), ...person.name.toLowerCase().split(/[^\p{L}\p{N}]+/u)];
  return [...new Set(pieces.filter((p) => p.length >= 4))];
}

/** Why a new password would be refused, in plain words, or null when it will do. */
async function passwordProblem(password: string, person: { email: string; name: string }): Promise<string | null> {
  const lower = password.toLowerCase();
  const words = personalWords(person);
  if (words.some((w) => lower.includes(w))) return 'Leave your name and e-mail address out of your password.';
  const result = await estimate(password, words);
  if (result.score >= MIN_SCORE) return null;
  const why = result.feedback.warning ? ` ${result.feedback.warning}` : '';
  const how = result.feedback.suggestions.length > 0 ? result.feedback.suggestions.join(' ') : 'Add another word or two that are less common.';
  return `This password is too easy to guess.${why} ${how}`;
}

/** The one rule for every new password (invite, change, reset): a 400 on `field` saying why. */
export async function checkNewPassword(password: string, person: { email: string; name: string }, field = 'password'): Promise<void> {
  const problem = await passwordProblem(password, person);
  if (problem) throw invalidField(field, problem);
}
