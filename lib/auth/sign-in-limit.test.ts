import { describe, expect, it } from "vitest";
import { signInGate, SIGN_IN_WINDOW_MS, type FailureCounts } from "./sign-in-limit";

// Ground truth constructed by hand: failures one minute apart ending at `now`, so the oldest
// counted failure and the minute it ages out are known without the code under test.
const MIN = 60_000;
const now = 100 * MIN;
const failures = (n: number) => Array.from({ length: n }, (_, i) => now - (n - i) * MIN);
const none: FailureCounts = { pair: [], knownAddress: false, accountUnknown: [], address: [] };

describe("signInGate", () => {
  it("lets attempts through below every limit", () => {
    expect(signInGate({ ...none, pair: failures(9), accountUnknown: failures(9), address: failures(29) }, now)).toEqual({ allowed: true });
  });

  it("refuses the tenth failure of one account from one address, with the minutes until the oldest ages out", () => {
    // Oldest of 10 is 10 min ago; it leaves the 15-min window in 5 min.
    expect(signInGate({ ...none, pair: failures(10), knownAddress: true }, now)).toEqual({ allowed: false, retryInMinutes: 5 });
  });

  it("caps an account from unknown addresses, but not from an address it signed in from", () => {
    const spread: FailureCounts = { ...none, accountUnknown: failures(10) };
    expect(signInGate(spread, now).allowed).toBe(false);
    expect(signInGate({ ...spread, knownAddress: true }, now)).toEqual({ allowed: true });
  });

  it("caps one address over all accounts at 30 failures", () => {
    // 30 failures 10 s apart, the oldest 10 min ago: it ages out in 5 min.
    const address = Array.from({ length: 30 }, (_, i) => now - 10 * MIN + i * 10_000);
    expect(signInGate({ ...none, address: address.slice(1) }, now)).toEqual({ allowed: true });
    expect(signInGate({ ...none, address }, now)).toEqual({ allowed: false, retryInMinutes: 5 });
  });

  it("lets an account through from its own known address even when that address is capped", () => {
    // A shared NAT: others failed 30 times from here, but this person signs in from here daily.
    const address = Array.from({ length: 30 }, (_, i) => now - 10 * MIN + i * 10_000);
    expect(signInGate({ ...none, knownAddress: true, address }, now)).toEqual({ allowed: true });
    // Their own pair limit still holds.
    expect(signInGate({ ...none, knownAddress: true, address, pair: failures(10) }, now).allowed).toBe(false);
  });

  it("waits for the last of several exceeded limits, and never says less than a minute", () => {
    const g = signInGate({ ...none, pair: failures(10), accountUnknown: failures(12) }, now);
    // pair reopens at now+5 min; unknown (12 failures, the 3rd oldest 10 min ago) at now+5 min too.
    expect(g).toEqual({ allowed: false, retryInMinutes: 5 });
    const edge = signInGate({ ...none, pair: [now - SIGN_IN_WINDOW_MS + 1, ...failures(9)] }, now);
    expect(edge).toEqual({ allowed: false, retryInMinutes: 1 });
  });
});
