import { ZxcvbnFactory, type ZxcvbnResult } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';

// The strength estimator @zxcvbn-ts/core with its common-password and common-word
// dictionaries (@zxcvbn-ts/language-common). Used for the hint while typing (client) and
// for the refusal of guessable passwords (server): OWASP ASVS 5.0 6.2.4 asks for a check
// against a list of common passwords.

let factory: ZxcvbnFactory | null = null;

function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs });
  return factory;
}

export type PasswordAssessment = {
  /** 0 (guessable in moments) to 4 (very hard to guess), zxcvbn's scale. */
  score: 0 | 1 | 2 | 3 | 4;
  /** The whole password is in (or a simple variant of) the common-password list. */
  common: boolean;
  acceptable: boolean;
  label: string;
  hint: string;
};

const LABELS = ['Very weak', 'Weak', 'Fair', 'Strong', 'Very strong'];

function isWholeCommonPassword(result: ZxcvbnResult, password: string): boolean {
  return result.sequence.some(
    (match) =>
      match.pattern === 'dictionary' &&
      (match as { dictionaryName?: string }).dictionaryName === 'passwords' &&
      match.token.length >= password.length - 1,
  );
}

/** Rates a password; `userInputs` (e-mail, handle, name) count as guessable words. */
export function assessPassword(password: string, userInputs: string[] = []): PasswordAssessment {
  const result = estimator().check(password.slice(0, 256), userInputs.filter(Boolean));
  const common = isWholeCommonPassword(result, password);
  const score = result.score as PasswordAssessment['score'];
  const acceptable = !common && score >= 2;
  let hint: string;
  if (common) hint = 'This is one of the most common passwords. Choose something else.';
  else if (score < 2)
    hint = 'Too easy to guess. A few unrelated words together make a strong password.';
  else if (score === 2) hint = 'Good enough. Longer is stronger.';
  else hint = 'A strong password.';
  return { score, common, acceptable, label: LABELS[score], hint };
}
