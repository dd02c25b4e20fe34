/**
 * The HiGHS session replaces its WebAssembly instance after an abort or when memory grows too large,
 * and keeps solving afterwards.
 */
import { HighsSession, isWasmFailure } from './highs-session';
import { runMip } from './run-mip';

// highs package README "Quick start" example: optimum 1100 (20 chairs, 10 tables).
const README_EXAMPLE = `Maximize
 profit: 30 chairs + 50 tables
Subject To
 carpentry: chairs + 2 tables <= 40
 finishing: 2 chairs + tables <= 50
Generals
 chairs tables
End`;

describe('HighsSession', () => {
  it('replaces the instance after a WebAssembly abort and solves again', async () => {
    const session = await HighsSession.create();
    let failure: unknown;
    try {
      runMip(session, { format: 'lp', data: 'Minimize\n obj: x\nSubject To\n c: x >= 1 +\nEnd' });
    } catch (err) {
      failure = err;
    }
    expect(isWasmFailure(failure)).toBe(true);
    expect(session.needsReplacement).toBe(true);
    await session.ensureHealthy();
    expect(session.recreated).toBe(1);
    expect(session.needsReplacement).toBe(false);
    expect(runMip(session, { format: 'lp', data: README_EXAMPLE }).objective).toBe(1100);
  });

  it('replaces the instance when its memory passes the limit', async () => {
    const session = await HighsSession.create({ memoryLimitBytes: 1, skipWarmUp: true });
    expect(session.memoryBytes).toBeGreaterThan(1);
    expect(session.needsReplacement).toBe(true);
    await session.ensureHealthy();
    expect(session.recreated).toBe(1);
    expect(runMip(session, { format: 'lp', data: README_EXAMPLE }).objective).toBe(1100);
  });
});
