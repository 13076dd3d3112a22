/**
 * The app codes of two-step sign-in against the published test vectors of RFC 6238 (M'Raihi et
 * al. 2011, Appendix B: SHA-1, seed "12345678901234567890", 30-second steps; the 8-digit values
 * there reduced mod 10⁶ give the 6-digit codes, RFC 4226 §5.3).
 */
import { describe, expect, it } from 'vitest';
import { totpStep } from '../../../server/services/two-step-sign-in';

/** Base32 (RFC 4648) of the ASCII seed "12345678901234567890". */
const SEED = 'GEZDGNBVGY3TQOJQGEZDGNBVGY3TQOJQ';

describe('totpStep (RFC 6238 Appendix B, SHA-1)', () => {
  it.each([
    [59, '287082'],
    [1111111109, '081804'],
    [1111111111, '050471'],
    [1234567890, '005924'],
    [2000000000, '279037'],
  ])('at T = %i s the code %s belongs to step floor(T/30)', (seconds, code) => {
    expect(totpStep(SEED, code, new Date(seconds * 1000))).toBe(Math.floor(seconds / 30));
  });

  it('accepts one step of clock drift either way, and no more', () => {
    const at = (s: number) => new Date(s * 1000);
    // 081804 is the code of step 37037036 (T = 1111111109).
    expect(totpStep(SEED, '081804', at(1111111109 + 30))).toBe(37037036);
    expect(totpStep(SEED, '081804', at(1111111109 - 30))).toBe(37037036);
    expect(totpStep(SEED, '081804', at(1111111109 + 60))).toBeNull();
    expect(totpStep(SEED, '081805', at(1111111109))).toBeNull();
    expect(totpStep(SEED, '81804', at(1111111109))).toBeNull();
  });
});
