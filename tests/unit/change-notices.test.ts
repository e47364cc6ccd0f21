// Change notices between processes: the payload the triggers send, read as hostile input, and the memories they keep.
import { describe, expect, test } from 'vitest';
import { CHANGE_CHANNEL, CURRENT_FOR_MS, NoticeBoard, readNotice, reconnectDelay } from '@/lib/live/notice';

describe('the channel and its payloads', () => {
  test('the channel is a plain identifier PostgreSQL keeps whole', () => {
    // PostgreSQL 17 manual, 4.1.1 "Identifiers and Key Words": unquoted identifiers are letters, digits and
    // underscores, and names are truncated past NAMEDATALEN-1 = 63 bytes.
    expect(CHANGE_CHANNEL).toMatch(/^[a-z_][a-z0-9_]*$/);
    expect(Buffer.byteLength(CHANGE_CHANNEL)).toBeLessThanOrEqual(63);
  });

  test.each([
    // PostgreSQL 17 manual, 9.16 "JSON Functions": json_build_object writes `"key" : value` with spaces, as in its
    // example json_build_object('foo', 1, 2, row(3,'bar')) → {"foo" : 1, "2" : {"f1":3,"f2":"bar"}}.
    ['a share link, as the trigger writes it', '{"kind" : "link", "id" : "0b6f8f0e-4a53-4c1e-9d59-2f3f7c9a1e11"}', { kind: 'link', id: '0b6f8f0e-4a53-4c1e-9d59-2f3f7c9a1e11' }],
    // better-auth's user ids are random letters and digits (from memory).
    ['an account', '{"kind":"user","id":"q3Zr8xYp1LmN0vB7"}', { kind: 'user', id: 'q3Zr8xYp1LmN0vB7' }],
  ])('accepts %s', (_name, payload, notice) => {
    expect(readNotice(payload)).toEqual(notice);
  });

  test.each([
    ['no payload', undefined],
    ['not JSON', 'link:123'],
    ['an unknown kind', '{"kind":"everything","id":"1"}'],
    ['an extra field', '{"kind":"link","id":"1","sql":"DROP TABLE brands"}'],
    ['markup in the id', '{"kind":"brand","id":"<script>alert(1)</script>"}'],
    ['a missing id', '{"kind":"brand","id":null}'],
    // PostgreSQL 17 manual, NOTIFY: "the payload string … must be shorter than 8000 bytes"; ours are far smaller.
    ['an oversized payload', JSON.stringify({ kind: 'link', id: 'x'.repeat(7000) })],
  ])('refuses %s', (_name, payload) => {
    expect(readNotice(payload)).toBeNull();
  });
});

describe('reconnecting', () => {
  test('waits twice as long after each failed attempt, from 100 ms up to 5 s', () => {
    expect([0, 1, 2, 3, 4, 5, 6, 7, 20].map(reconnectDelay)).toEqual([100, 200, 400, 800, 1600, 3200, 5000, 5000, 5000]);
  });
});

/** A board on a clock the test moves. */
function boardAt(start = 1_000_000) {
  const clock = { now: start };
  const board = new NoticeBoard(() => clock.now);
  return { board, clock };
}

describe('notice-kept memory', () => {
  test('answers nothing until notices are known to reach the process', async () => {
    const { board } = boardAt();
    const memory = board.memory<string>('brands', ['brand']);
    let lookups = 0;
    const lookup = async () => `value ${++lookups}`;
    expect(await memory.remember('k', lookup)).toBe('value 1');
    expect(await memory.remember('k', lookup)).toBe('value 2');
    expect(memory.size).toBe(0);
  });

  test('keeps a lookup until a notice of its kind, and only of its kind', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const brands = board.memory<string>('brands', ['brand']);
    const links = board.memory<string>('links', ['link']);
    await brands.remember('b', async () => 'brand');
    await links.remember('l', async () => 'link');
    expect(brands.get('b')).toBe('brand');
    board.hear({ kind: 'link', id: 'x' });
    expect(links.get('l')).toBeUndefined();
    expect(brands.get('b')).toBe('brand');
  });

  test('does not keep a lookup that was running when a notice arrived', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const memory = board.memory<string>('versions', ['version']);
    let finish!: (v: string) => void;
    const pending = memory.remember('latest', () => new Promise<string>((r) => (finish = r)));
    board.hear({ kind: 'version', id: 'v2' });
    finish('version 1');
    expect(await pending).toBe('version 1');
    expect(memory.get('latest')).toBeUndefined();
  });

  test('stops answering once the connection has not been confirmed current for the window', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const memory = board.memory<string>('roles', ['member']);
    await memory.remember('r', async () => 'owner');
    clock.now += CURRENT_FOR_MS - 1;
    expect(memory.get('r')).toBe('owner');
    clock.now += 1;
    expect(memory.get('r')).toBeUndefined();
    board.confirm(clock.now);
    expect(memory.get('r')).toBe('owner');
  });

  test('drops everything when the connection is lost and again when it is back', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const memory = board.memory<string>('grants', ['link']);
    await memory.remember('t', async () => 'grant');
    board.lost();
    expect(memory.size).toBe(0);
    expect(board.current).toBe(false);
    await memory.remember('t', async () => 'grant');
    expect(memory.size).toBe(0);
    board.resume(clock.now);
    expect(board.current).toBe(true);
  });

  test('holds at most its number of entries, the oldest going first', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const memory = board.memory<number>('small', ['brand'], { maxEntries: 2 });
    for (const k of ['a', 'b', 'c']) await memory.remember(k, async () => k.charCodeAt(0));
    expect([memory.get('a'), memory.get('b'), memory.get('c')]).toEqual([undefined, 98, 99]);
  });

  test('drops only what a notice concerns when told how, and keeps only what is worth keeping', async () => {
    const { board, clock } = boardAt();
    board.resume(clock.now);
    const sessions = board.memory<{ sessionId: string; userId: string } | null>('sessions', ['session', 'user'], {
      concerns: (notice, kept) => !kept || (notice.kind === 'session' ? kept.sessionId === notice.id : kept.userId === notice.id),
      keepIf: (kept) => kept !== null,
    });
    await sessions.remember('cookie-a', async () => ({ sessionId: 's1', userId: 'u1' }));
    await sessions.remember('cookie-b', async () => ({ sessionId: 's2', userId: 'u2' }));
    await sessions.remember('forged', async () => null);
    expect(sessions.size).toBe(2);
    board.hear({ kind: 'session', id: 's1' });
    expect(sessions.get('cookie-a')).toBeUndefined();
    expect(sessions.get('cookie-b')).toEqual({ sessionId: 's2', userId: 'u2' });
    board.hear({ kind: 'user', id: 'u2' });
    expect(sessions.size).toBe(0);
  });
});
