import type { SignedInUser } from './passport';
import { SessionCache, type OpenSession } from './session-cache';

const SID = '00000000-0000-4000-8000-000000000001';
const OTHER = '00000000-0000-4000-8000-000000000002';

function user(id: number, sessionId: string): SignedInUser {
  return { id, email: `u${id}@example.test`, name: `User ${id}`, sessionId };
}

/** A session table in memory, counting the lookups that reach it. */
function table() {
  const open = new Map<string, OpenSession>();
  const calls: string[] = [];
  const lookup = async (sessionId: string, userId: number): Promise<OpenSession | null> => {
    calls.push(sessionId);
    const found = open.get(sessionId);
    return found && found.user.id === userId ? found : null;
  };
  const add = (sessionId: string, userId: number, expiresAt = Date.now() + 3_600_000) => open.set(sessionId, { user: user(userId, sessionId), expiresAt });
  return { open, calls, lookup, add };
}

describe('SessionCache', () => {
  afterEach(() => jest.useRealTimers());

  it('asks once for a burst of requests with the same token, and again after the time to live', async () => {
    jest.useFakeTimers({ now: 1_000_000, doNotFake: ['nextTick', 'setImmediate', 'queueMicrotask'] });
    const t = table();
    t.add(SID, 7);
    const cache = new SessionCache(5000, t.lookup);
    const answers = await Promise.all([cache.find(SID, 7), cache.find(SID, 7), cache.find(SID, 7)]);
    expect(answers.map((a) => a?.id)).toEqual([7, 7, 7]);
    expect(await cache.find(SID, 7)).toEqual(user(7, SID));
    expect(t.calls).toHaveLength(1);
    jest.setSystemTime(1_000_000 + 5001);
    await cache.find(SID, 7);
    expect(t.calls).toHaveLength(2);
  });

  it('keeps no refusal: a session that is not open is asked for every time', async () => {
    const t = table();
    const cache = new SessionCache(5000, t.lookup);
    expect(await cache.find(SID, 7)).toBeNull();
    t.add(SID, 7);
    expect(await cache.find(SID, 7)).toEqual(user(7, SID));
    expect(await cache.find(SID, 8)).toBeNull();
    expect(t.calls).toHaveLength(3);
  });

  it('forgets an ended session at once, and every session of an account', async () => {
    const t = table();
    t.add(SID, 7);
    t.add(OTHER, 7);
    const cache = new SessionCache(60_000, t.lookup);
    await cache.find(SID, 7);
    await cache.find(OTHER, 7);
    t.open.delete(SID);
    cache.forget(SID);
    expect(await cache.find(SID, 7)).toBeNull();
    expect(await cache.find(OTHER, 7)).not.toBeNull();
    t.open.delete(OTHER);
    cache.forgetUser(7);
    expect(await cache.find(OTHER, 7)).toBeNull();
  });

  it('does not keep an answer read before the session ended', async () => {
    const t = table();
    t.add(SID, 7);
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const cache = new SessionCache(60_000, async (sid, uid) => {
      const found = await t.lookup(sid, uid);
      await gate;
      return found;
    });
    const early = cache.find(SID, 7);
    t.open.delete(SID);
    cache.forget(SID);
    release();
    expect(await early).not.toBeNull();
    expect(await cache.find(SID, 7)).toBeNull();
  });

  it('keeps a session no longer than it lasts', async () => {
    jest.useFakeTimers({ now: 1_000_000, doNotFake: ['nextTick', 'setImmediate', 'queueMicrotask'] });
    const t = table();
    t.add(SID, 7, 1_000_000 + 1000);
    const cache = new SessionCache(60_000, t.lookup);
    await cache.find(SID, 7);
    jest.setSystemTime(1_000_000 + 1001);
    t.open.delete(SID);
    expect(await cache.find(SID, 7)).toBeNull();
  });

  it('asks every time with a time to live of 0, and drops the oldest entry when full', async () => {
    const t = table();
    t.add(SID, 7);
    t.add(OTHER, 8);
    const off = new SessionCache(0, t.lookup);
    await off.find(SID, 7);
    await off.find(SID, 7);
    expect(t.calls).toHaveLength(2);
    const small = new SessionCache(60_000, t.lookup, 1);
    await small.find(SID, 7);
    await small.find(OTHER, 8);
    await small.find(SID, 7);
    expect(t.calls).toHaveLength(5);
  });
});
