import { HttpError } from './errors.js';

export interface SignInDelayOptions {
  /** Wait after the first failure; each further failure doubles it. */
  firstMs: number;
  /** The longest wait, so a stranger's wrong guesses can slow an account's owner but never lock them out. */
  capMs: number;
}

/** The 429 for an attempt that came before its wait was over; the caller sets Retry-After to the same seconds. */
export const signInTooSoon = (waitS: number) =>
  new HttpError(429, `several sign-ins with this e-mail failed recently, so each new try must wait longer; wait ${waitS} s and try again`);

export const DEFAULT_SIGN_IN_DELAY: SignInDelayOptions = { firstMs: 1000, capMs: 30_000 };

/** Failures older than this are forgotten, so a slip last week does not delay today. */
const FORGET_AFTER_MS = 15 * 60 * 1000;
const MAX_TRACKED = 10_000;

interface Entry { failures: number; notBefore: number; lastFailure: number }

/**
 * Per-account sign-in delay in place of a lockout: each failed attempt makes the next attempt on that e-mail wait
 * (1 s, 2 s, 4 s … up to the cap) before it is even evaluated; a right password after the wait signs in and clears
 * the count. Keyed by the e-mail as typed (normalised), known or not, so the delay itself says nothing about
 * whether an account exists.
 */
export class SignInDelay {
  private readonly entries = new Map<string, Entry>();

  constructor(private readonly options: SignInDelayOptions, private readonly now: () => number = () => Date.now()) {}

  /** Seconds still to wait before this e-mail may be tried, or 0. */
  waitSeconds(email: string): number {
    const entry = this.current(email);
    if (!entry) return 0;
    return Math.max(0, Math.ceil((entry.notBefore - this.now()) / 1000));
  }

  failed(email: string): void {
    const now = this.now();
    const entry = this.current(email) ?? { failures: 0, notBefore: 0, lastFailure: 0 };
    entry.failures += 1;
    entry.lastFailure = now;
    entry.notBefore = now + Math.min(this.options.capMs, this.options.firstMs * 2 ** Math.min(entry.failures - 1, 30));
    if (this.entries.size >= MAX_TRACKED && !this.entries.has(email)) this.dropOldest();
    this.entries.set(email, entry);
  }

  succeeded(email: string): void {
    this.entries.delete(email);
  }

  private current(email: string): Entry | undefined {
    const entry = this.entries.get(email);
    if (entry && this.now() - entry.lastFailure > FORGET_AFTER_MS) {
      this.entries.delete(email);
      return undefined;
    }
    return entry;
  }

  private dropOldest(): void {
    const oldest = this.entries.keys().next();
    if (!oldest.done) this.entries.delete(oldest.value);
  }
}
