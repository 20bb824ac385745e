// Sign-in attempt limits, as pure arithmetic over the failures the database counted.
//
// Three counts, all over the same sliding window:
// - one account from one client address (the usual lockout);
// - one account from every address it has never signed in from successfully ("unknown"
//   addresses), so guessing from many addresses at once, or with forged forwarding headers, is
//   capped as well — while the owner's sign-in from an address they used before still works;
// - one address over every account, so one client cannot try a password on many accounts.
//   An account's own known address is exempt from this one: behind a shared NAT, a colleague's
//   mistyping must not lock out a person who signs in from there every day (the pair limit
//   still caps that account from that address).

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
/** Failures for one account from one address before that pair is refused. */
const MAX_FAILED_PER_ACCOUNT_ADDRESS = 10;
/** Failures for one account from all its unknown addresses before those are refused. */
const MAX_FAILED_PER_ACCOUNT_UNKNOWN = 10;
/** Failures from one address, whatever the account, before that address is refused. */
const MAX_FAILED_PER_ADDRESS = 30;
/** An address is "known" for an account after a successful sign-in from it in this time. */
export const KNOWN_ADDRESS_MS = 30 * 24 * 60 * 60 * 1000;

export type FailureCounts = {
  /** Times (ms) of failures in the window for this account from this address, oldest first. */
  pair: readonly number[];
  /** Whether this account signed in successfully from this address lately. */
  knownAddress: boolean;
  /** Times of failures in the window for this account from its unknown addresses, oldest first. */
  accountUnknown: readonly number[];
  /** Times of failures in the window from this address over all accounts, oldest first. */
  address: readonly number[];
};

export type SignInGate = { allowed: true } | { allowed: false; retryInMinutes: number };

/** When a full count lets the next attempt through: the failure that ages out first. */
function reopensAt(times: readonly number[], max: number): number | null {
  if (times.length < max) return null;
  return times[times.length - max] + SIGN_IN_WINDOW_MS;
}

/**
 * Whether one more password may be checked now, and if not, in how many whole minutes (at
 * least 1) the earliest of the exceeded limits lets one through.
 */
export function signInGate(c: FailureCounts, now: number): SignInGate {
  const reopen = [
    reopensAt(c.pair, MAX_FAILED_PER_ACCOUNT_ADDRESS),
    c.knownAddress ? null : reopensAt(c.accountUnknown, MAX_FAILED_PER_ACCOUNT_UNKNOWN),
    c.knownAddress ? null : reopensAt(c.address, MAX_FAILED_PER_ADDRESS),
  ].filter((t): t is number => t !== null);
  if (reopen.length === 0) return { allowed: true };
  const at = Math.max(...reopen);
  return { allowed: false, retryInMinutes: Math.max(1, Math.ceil((at - now) / 60_000)) };
}
