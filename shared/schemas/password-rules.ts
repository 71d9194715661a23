import { COMMON_PASSWORD_WORDS, COMMON_PASSWORDS } from './common-passwords.js';

const WORDS = new Set(COMMON_PASSWORD_WORDS);
const WHOLE = new Set(COMMON_PASSWORDS);
const LOOK_ALIKES: Record<string, string> = { '0': 'o', '1': 'i', '3': 'e', '4': 'a', '5': 's', '7': 't', '@': 'a', '$': 's', '!': 'i' };

/** Fewer distinct characters than this and a password is a repetition (`aaaaaaaaaaaa`, `abcabcabcabc`). */
const MIN_DISTINCT = 5;

/** True when the text is one straight run of code points up or down (`abcdefghijkl`, `987654321098` with 0↔9 wrap). */
function isStraightRun(text: string): boolean {
  const codes = [...text].map((c) => c.codePointAt(0)!);
  const step = (a: number, b: number) => {
    if (a === 57 && b === 48) return 1; // 9 → 0
    if (a === 48 && b === 57) return -1; // 0 → 9
    return b - a;
  };
  const first = step(codes[0], codes[1]);
  return Math.abs(first) === 1 && codes.every((c, i) => i === 0 || step(codes[i - 1], c) === first);
}

/** True when the text is one listed word repeated one or more times (`passwordpassword`). */
function isRepeatedWord(text: string): boolean {
  if (!text) return false;
  for (let size = 1; size <= text.length; size++) {
    if (text.length % size === 0 && WORDS.has(text.slice(0, size)) && text.slice(0, size).repeat(text.length / size) === text) return true;
  }
  return false;
}

/**
 * Why a new password is too easy to guess, or null when it is acceptable. Length is checked by the schema; this
 * refuses blank passwords, repetitions of a few characters, straight runs, listed passwords, and a listed word
 * dressed with digits or symbols at its ends or look-alike digits (`P@ssword2026!`).
 *
 * @param password - the password as typed
 * @returns a message naming the problem, or null
 * @example weakPasswordReason('123456789012') // 'password is a common password; …'
 */
export function weakPasswordReason(password: string): string | null {
  if (password.trim() === '') return 'password must not be only spaces';
  if (new Set(password).size < MIN_DISTINCT) return `password must use at least ${MIN_DISTINCT} different characters`;
  const lower = password.toLowerCase();
  if (isStraightRun(lower)) return 'password must not be a straight run of characters';
  const common = 'password is a common password; choose a phrase of several unrelated words';
  if (WHOLE.has(lower)) return common;
  const readAsLetters = (text: string) => [...text].map((c) => LOOK_ALIKES[c] ?? c).join('');
  const isWord = (text: string) => isRepeatedWord(text) || isRepeatedWord(readAsLetters(text)) || isRepeatedWord(text.replace(/[^a-z]/g, ''));
  // Digits and symbols dressing the ends are taken off in every split up to six each side, so a look-alike
  // inside (`$ecret`) is read as a letter while a year at the end (`2026!`) is dropped.
  const lead = Math.min(6, /^[^a-z]*/.exec(lower)![0].length);
  const trail = Math.min(6, /[^a-z]*$/.exec(lower)![0].length);
  for (let start = 0; start <= lead; start++) {
    for (let end = 0; end <= trail; end++) {
      if (isWord(lower.slice(start, lower.length - end))) return common;
    }
  }
  if (isWord(lower.replace(/^[^a-z]+|[^a-z]+$/g, ''))) return common;
  return null;
}
