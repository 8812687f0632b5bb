import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';

/**
 * The password rule the server and the forms share: zxcvbn's estimate over the common-password list and keyboard
 * patterns that ship with @zxcvbn-ts/language-common. A score of 3 of 4 is the estimator's own "safely
 * unguessable" level; below it the password is one of the well-known lists or a short pattern of one.
 */
export const PASSWORD_MIN_SCORE = 3;

let estimator: ZxcvbnFactory | null = null;
const estimate = () => (estimator ??= new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs }));

export const WEAK_PASSWORD_MESSAGE = 'this password is too common or too easy to guess: add a few unusual words';

/** True when the password is strong enough; the e-mail and name count as words an attacker would try first. */
export function isStrongPassword(password: string, userInputs: string[] = []): boolean {
  // The estimator's cost grows with length; past 128 characters the length rule refuses it anyway.
  return estimate().check(password.slice(0, 128), userInputs.filter(Boolean)).score >= PASSWORD_MIN_SCORE;
}
