import { describe, expect, it } from 'vitest';
import { LoginThrottle } from './login-throttle';

function clocked(freeFailures = 3) {
  let now = 1_000_000;
  const slept: number[] = [];
  const throttle = new LoginThrottle({
    freeFailures,
    baseDelayMs: 250,
    maxDelayMs: 4000,
    windowMs: 15 * 60_000,
    maxKeys: 3,
    now: () => now,
    // The clock moves only when the test says so: attempts made together start at the same time.
    sleep: async (ms) => {
      slept.push(ms);
    },
  });
  return { throttle, slept, advance: (ms: number) => (now += ms) };
}

describe('progressive delay per account [CP: OWASP authentication guidance: delay, do not lock out]', () => {
  it('no delay for the first failures, then doubling up to the ceiling', () => {
    const { throttle } = clocked();
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 20].map((n) => throttle.delayAfter(n))).toEqual([0, 0, 0, 0, 250, 500, 1000, 2000, 4000, 4000]);
  });

  it('an attempt after failures waits, and parallel attempts queue behind each other', async () => {
    const { throttle, slept } = clocked();
    for (let i = 0; i < 5; i++) throttle.failed('a');
    // 5 failures: 500 ms before the next attempt; two attempts at once wait 500 and 1000 ms.
    await Promise.all([throttle.wait('a'), throttle.wait('a')]);
    expect(slept).toEqual([500, 1000]);
  });

  it('a stranger cannot queue the owner out: however many attempts wait, none waits longer than the ceiling', async () => {
    // A queue without a bound would let many guesses sent at once (from many addresses) keep the
    // owner, with the right password, waiting for hours: a lock-out by other means.
    const { throttle, slept } = clocked();
    for (let i = 0; i < 20; i++) throttle.failed('a');
    const waits = await Promise.all(Array.from({ length: 200 }, () => throttle.wait('a')));
    expect(Math.max(...waits)).toBe(4000);
    expect(Math.max(...slept)).toBe(4000);
  });

  it('another account is not slowed, a success clears the count, and old failures are forgotten', async () => {
    const { throttle, slept, advance } = clocked();
    for (let i = 0; i < 6; i++) throttle.failed('a');
    expect(await throttle.wait('b')).toBe(0);
    throttle.succeeded('a');
    expect(await throttle.wait('a')).toBe(0);
    for (let i = 0; i < 6; i++) throttle.failed('c');
    advance(16 * 60_000);
    expect(await throttle.wait('c')).toBe(0);
    expect(slept).toEqual([]);
  });

  it('keeps at most maxKeys accounts', () => {
    const { throttle } = clocked();
    for (const k of ['a', 'b', 'c', 'd']) throttle.failed(k);
    expect(throttle.failures('a')).toBe(0);
    expect(throttle.failures('d')).toBe(1);
  });
});
