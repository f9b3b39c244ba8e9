/**
 * The rules for following a folder (src/io/folder-poll.ts, folder-watch.ts), with a fake folder
 * and a fake clock: nothing here touches the disk or waits on real time. The rules themselves are
 * common practice, no source: read a file once two looks agree on its size and time.
 */
import { describe, expect, it } from 'vitest';
import type { FolderEntry, PollEvent } from '../../src/io/folder-poll';
import { FolderPoller, followFolder, type Sleep } from '../../src/io/folder-watch';
import { compileWatchPattern, WatchPatternError } from '../../src/io/watch-pattern';

/** A folder in memory: files with sizes and times the test changes between looks. */
class FakeFolder {
  files = new Map<string, FolderEntry>();
  looks = 0;
  failNext = false;
  write(name: string, size_bytes: number, modified_ms: number, identity?: string): void {
    this.files.set(name, { name, size_bytes, modified_ms, ...(identity ? { identity } : {}) });
  }
  rename(from: string, to: string): void {
    const e = this.files.get(from);
    if (!e) throw new Error(`no ${from}`);
    this.files.delete(from);
    this.files.set(to, { ...e, name: to });
  }
  async list(): Promise<FolderEntry[]> {
    this.looks += 1;
    if (this.failNext) {
      this.failNext = false;
      throw new Error('the share went away');
    }
    return [...this.files.values()].map((e) => ({ ...e }));
  }
}

/** A clock the test moves: each sleep waits until the test calls tick(). */
class FakeClock {
  now_ms = 0;
  private waiting: { until: number; resolve: () => void }[] = [];
  sleep: Sleep = (ms, signal) =>
    new Promise((resolve) => {
      if (signal.aborted) return resolve();
      this.waiting.push({ until: this.now_ms + ms, resolve });
      signal.addEventListener('abort', () => resolve());
    });
  /** Moves time on and lets the loop run until it sleeps again. */
  async tick(ms: number): Promise<void> {
    this.now_ms += ms;
    const due = this.waiting.filter((w) => w.until <= this.now_ms);
    this.waiting = this.waiting.filter((w) => w.until > this.now_ms);
    for (const w of due) w.resolve();
    for (let i = 0; i < 20; i++) await Promise.resolve();
  }
}

const ready = (events: readonly PollEvent[]) => events.filter((e) => e.kind === 'ready').map((e) => (e.kind === 'ready' ? e.entry.name : ''));

describe('FolderPoller: the size-stable rule', () => {
  it('reads a file only after two looks agree on its size and time, and once', () => {
    const poller = new FolderPoller(compileWatchPattern('*.csv'));
    const folder = new FakeFolder();
    folder.write('shot-1.csv', 100, 1);
    expect(poller.poll([...folder.files.values()])).toEqual([]);
    expect(poller.waiting()).toEqual(['shot-1.csv']);
    expect(ready(poller.poll([...folder.files.values()]))).toEqual(['shot-1.csv']);
    expect(poller.poll([...folder.files.values()])).toEqual([]);
    expect(poller.waiting()).toEqual([]);
  });

  it('waits while a file grows between looks (written in pieces), then reads it whole', () => {
    const poller = new FolderPoller(compileWatchPattern('*.csv'));
    const f = new FakeFolder();
    f.write('a.csv', 10, 1);
    poller.poll([...f.files.values()]);
    f.write('a.csv', 2000, 2);
    expect(ready(poller.poll([...f.files.values()]))).toEqual([]);
    f.write('a.csv', 5000, 3);
    expect(ready(poller.poll([...f.files.values()]))).toEqual([]);
    const events = poller.poll([...f.files.values()]);
    expect(events).toEqual([{ kind: 'ready', entry: { name: 'a.csv', size_bytes: 5000, modified_ms: 3 }, again: false }]);
  });

  it('a time change alone (same size, rewritten) also counts as a change', () => {
    const poller = new FolderPoller(() => true);
    poller.poll([{ name: 'a.csv', size_bytes: 10, modified_ms: 1 }]);
    expect(ready(poller.poll([{ name: 'a.csv', size_bytes: 10, modified_ms: 2 }]))).toEqual([]);
    expect(ready(poller.poll([{ name: 'a.csv', size_bytes: 10, modified_ms: 2 }]))).toEqual(['a.csv']);
  });

  it('never reads an empty file (a file just created), and reads it once it has content', () => {
    const poller = new FolderPoller(() => true);
    for (let i = 0; i < 3; i++) expect(poller.poll([{ name: 'new.csv', size_bytes: 0, modified_ms: 5 }])).toEqual([]);
    poller.poll([{ name: 'new.csv', size_bytes: 900, modified_ms: 6 }]);
    expect(ready(poller.poll([{ name: 'new.csv', size_bytes: 900, modified_ms: 6 }]))).toEqual(['new.csv']);
  });

  it('reads a file again, marked as such, when it grows after it was read', () => {
    const poller = new FolderPoller(() => true);
    const a = { name: 'a.csv', size_bytes: 10, modified_ms: 1 };
    poller.poll([a]);
    poller.poll([a]);
    const grown = { name: 'a.csv', size_bytes: 20, modified_ms: 2 };
    expect(poller.poll([grown])).toEqual([]);
    expect(poller.poll([grown])).toEqual([{ kind: 'ready', entry: grown, again: true }]);
  });

  it('does not read a renamed file twice: the same inode, or the same size and time, under a new name', () => {
    const poller = new FolderPoller(compileWatchPattern('*.csv'));
    const f = new FakeFolder();
    f.write('a.csv', 10, 1, 'dev:7');
    f.write('b.csv', 30, 3);
    poller.poll([...f.files.values()]);
    poller.poll([...f.files.values()]);
    f.rename('a.csv', 'a-renamed.csv');
    f.rename('b.csv', 'b-renamed.csv');
    const events = poller.poll([...f.files.values()]);
    expect(events).toEqual([
      { kind: 'renamed', from: 'a.csv', to: 'a-renamed.csv' },
      { kind: 'renamed', from: 'b.csv', to: 'b-renamed.csv' },
    ]);
    expect(ready(poller.poll([...f.files.values()]))).toEqual([]);
  });

  it('a file renamed to a name outside the pattern vanishes; renamed into it, it is a new file', () => {
    const poller = new FolderPoller(compileWatchPattern('*.csv'));
    poller.poll([{ name: 'x.tmp', size_bytes: 10, modified_ms: 1 }]);
    expect(poller.poll([{ name: 'x.tmp', size_bytes: 10, modified_ms: 1 }])).toEqual([]);
    expect(poller.poll([{ name: 'x.csv', size_bytes: 10, modified_ms: 1 }])).toEqual([]);
    expect(ready(poller.poll([{ name: 'x.csv', size_bytes: 10, modified_ms: 1 }]))).toEqual(['x.csv']);
    expect(poller.poll([{ name: 'x.tmp', size_bytes: 10, modified_ms: 1 }])).toEqual([{ kind: 'vanished', name: 'x.csv', read: true }]);
  });

  it('forgets files that vanish, saying whether they had been read', () => {
    const poller = new FolderPoller(() => true);
    poller.poll([
      { name: 'a.csv', size_bytes: 1, modified_ms: 1 },
      { name: 'b.csv', size_bytes: 1, modified_ms: 2 },
    ]);
    poller.poll([{ name: 'a.csv', size_bytes: 1, modified_ms: 1 }, { name: 'b.csv', size_bytes: 2, modified_ms: 3 }]);
    expect(poller.poll([])).toEqual([
      { kind: 'vanished', name: 'a.csv', read: true },
      { kind: 'vanished', name: 'b.csv', read: false },
    ]);
    expect(poller.size).toBe(0);
  });
});

describe('followFolder: the loop, on a fake clock', () => {
  it('looks every interval, reads files as they settle, survives a failed listing, stops on abort', async () => {
    const folder = new FakeFolder();
    const clock = new FakeClock();
    const controller = new AbortController();
    const seen: string[] = [];
    const listErrors: string[] = [];
    const done = followFolder({
      source: folder,
      poller: new FolderPoller(compileWatchPattern('*.csv')),
      interval_ms: 2000,
      sleep: clock.sleep,
      signal: controller.signal,
      onEvent: (e) => {
        if (e.kind === 'ready') seen.push(`${clock.now_ms}:${e.entry.name}`);
      },
      onListError: (error) => listErrors.push(String(error)),
    });
    folder.write('shot-1.csv', 50, 1);
    await clock.tick(0);
    expect(folder.looks).toBe(1);
    folder.write('shot-1.csv', 80, 2);
    await clock.tick(2000);
    await clock.tick(2000);
    expect(seen).toEqual(['4000:shot-1.csv']);
    folder.failNext = true;
    await clock.tick(2000);
    expect(listErrors).toEqual(['Error: the share went away']);
    folder.write('shot-2.csv', 70, 9);
    folder.write('notes.txt', 70, 9);
    await clock.tick(2000);
    await clock.tick(2000);
    expect(seen).toEqual(['4000:shot-1.csv', '10000:shot-2.csv']);
    controller.abort();
    await done;
    const looks = folder.looks;
    await clock.tick(10000);
    expect(folder.looks).toBe(looks);
  });

  it('does not look while paused, and goes on after', async () => {
    const folder = new FakeFolder();
    const clock = new FakeClock();
    const controller = new AbortController();
    let paused = true;
    const seen: string[] = [];
    const done = followFolder({
      source: folder,
      poller: new FolderPoller(() => true),
      interval_ms: 1000,
      sleep: clock.sleep,
      signal: controller.signal,
      paused: () => paused,
      onEvent: (e) => {
        if (e.kind === 'ready') seen.push(e.entry.name);
      },
    });
    folder.write('a.csv', 5, 5);
    for (let i = 0; i < 3; i++) await clock.tick(1000);
    expect(folder.looks).toBe(0);
    paused = false;
    await clock.tick(1000);
    await clock.tick(1000);
    expect(seen).toEqual(['a.csv']);
    controller.abort();
    await done;
  });

  it('with once: two looks one interval apart, then returns; a file still growing is left waiting', async () => {
    const folder = new FakeFolder();
    const clock = new FakeClock();
    const poller = new FolderPoller(() => true);
    folder.write('done.csv', 5, 5);
    folder.write('growing.csv', 5, 5);
    const seen: string[] = [];
    const done = followFolder({
      source: folder,
      poller,
      interval_ms: 500,
      sleep: clock.sleep,
      signal: new AbortController().signal,
      once: true,
      onEvent: (e) => {
        if (e.kind === 'ready') seen.push(e.entry.name);
      },
    });
    await clock.tick(0);
    folder.write('growing.csv', 50, 6);
    await clock.tick(500);
    await done;
    expect(folder.looks).toBe(2);
    expect(seen).toEqual(['done.csv']);
    expect(poller.waiting()).toEqual(['growing.csv']);
  });
});

describe('compileWatchPattern', () => {
  it.each([
    ['*.csv', 'shot-1.csv', true],
    ['*.csv', 'SHOT-1.CSV', true],
    ['*.csv', 'shot-1.csv.tmp', false],
    ['shot-??.csv', 'shot-12.csv', true],
    ['shot-??.csv', 'shot-1.csv', false],
    ['shot-[0-9]*.csv', 'shot-7a.csv', true],
    ['shot-[!0-9]*.csv', 'shot-7a.csv', false],
    ['*.{csv,txt}', 'a.txt', true],
    ['*.{csv,txt}', 'a.tsv', false],
    ['a+b(1).csv', 'a+b(1).csv', true],
  ])('%s on %s → %s', (pattern, name, expected) => {
    expect(compileWatchPattern(pattern)(name)).toBe(expected);
  });

  it.each([
    ['', /empty/],
    ['data/*.csv', /names a folder/],
    ['[abc.csv', /never closes it with \]/],
    ['*.{csv', /never closes it with \}/],
    ['{a,{b}}', /nests/],
    ['x'.repeat(201), /at most 200/],
  ])('refuses %j with one line', (pattern, message) => {
    expect(() => compileWatchPattern(pattern)).toThrow(WatchPatternError);
    expect(() => compileWatchPattern(pattern)).toThrow(message);
  });
});
