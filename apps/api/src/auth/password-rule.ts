import core from '@zxcvbn-ts/core';
import common from '@zxcvbn-ts/language-common';
import en from '@zxcvbn-ts/language-en';
import { invalidField } from '../errors.ts';

/** zxcvbn's score (0–4) a new password must reach: 3 is "safely unguessable" to an offline attack at a slow hash. */
const MIN_SCORE = 3;

let estimator: core.ZxcvbnFactory | null = null;
/** Built on first use: loading the dictionaries takes a few hundred milliseconds. */
function estimate(password: string, userInputs: string[]) {
  estimator ??= new core.ZxcvbnFactory({
    translations: en.translations,
    graphs: common.adjacencyGraphs,
    dictionary: { ...common.dictionary, ...en.dictionary },
  });
  return estimator.check(password, userInputs);
}

/** The person's name and e-mail in the pieces a password might borrow (4 letters or more: shorter ones turn up inside ordinary words). */
function personalWords(person: { email: string; name: string }): string[] {
  const local = person.email.toLowerCase().split('@')[0] ?? '';
  const pieces = [local, ...local.split(/[^\p{L}\p{N}]+/u), ...person.name.toLowerCase().split(/[^\p{L}\p{N}]+/u)];
  return [...new Set(pieces.filter((p) => p.length >= 4))];
}

/** Why a new password would be refused, in plain words, or null when it will do. */
export function passwordProblem(password: string, person: { email: string; name: string }): string | null {
  const lower = password.toLowerCase();
  const words = personalWords(person);
  if (words.some((w) => lower.includes(w))) return 'Leave your name and e-mail address out of your password.';
  const result = estimate(password, words);
  if (result.score >= MIN_SCORE) return null;
  const why = result.feedback.warning ? ` ${result.feedback.warning}` : '';
  const how = result.feedback.suggestions.length > 0 ? result.feedback.suggestions.join(' ') : 'Add another word or two that are less common.';
  return `This password is too easy to guess.${why} ${how}`;
}

/** The one rule for every new password (invite, change, reset): a 400 on `field` saying why. */
export function checkNewPassword(password: string, person: { email: string; name: string }, field = 'password'): void {
  const problem = passwordProblem(password, person);
  if (problem) throw invalidField(field, problem);
}
