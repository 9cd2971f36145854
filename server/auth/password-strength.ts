import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';
import { MIN_PASSWORD_SCORE } from '../../db/contracts';
import { badRequest } from '../http-error';

// Built once: the dictionaries take a moment to load.
const zxcvbn = new ZxcvbnFactory({
  dictionary: { ...common.dictionary, ...en.dictionary },
  graphs: common.adjacencyGraphs,
  translations: en.translations,
});

/** Refuses a weak password with the strength package's own advice; the person's name and address count against it. */
export function requireStrongPassword(password: string, userInputs: string[], field = 'password') {
  const r = zxcvbn.check(password, userInputs);
  if (r.score >= MIN_PASSWORD_SCORE) return;
  const advice = [r.feedback.warning, ...r.feedback.suggestions].filter(Boolean).join(' ');
  const message = `this password is too easy to guess${advice ? `: ${advice}` : ''}`;
  throw badRequest(message, { [field]: message });
}
