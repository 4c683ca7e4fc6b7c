// When part pages are rendered: runs start as pages arrive (once enough wait), never two at once, at most a
// full run each, the rest once every page is in; a failed run fails the build; a build being abandoned waits
// for the run going. The renderer here is the test's own: it records each run and ends it when told.

import { describe, expect, it } from 'vitest';
import { PartPageRuns } from '../../src/build/part-page-runs.js';
import type { PartPageData } from '../../src/pages/site-data.js';

const page = (n: number) => ({ id: `P${n}` }) as PartPageData;

/** A renderer whose runs end when the test says, each writing as many pages as it was given. */
function heldRenderer() {
  const runs: { ids: string[]; end(error?: Error): void }[] = [];
  let active = 0;
  let most = 0;
  const render = (pages: PartPageData[]) =>
    new Promise<number>((resolve, reject) => {
      most = Math.max(most, ++active);
      runs.push({
        ids: pages.map((p) => p.id),
        end: (error) => {
          active--;
          if (error) reject(error);
          else resolve(pages.length);
        },
      });
    });
  return { runs, render, most: () => most };
}

/** Let the promise callbacks of a finished run happen. */
const settle = () => new Promise((resolve) => setImmediate(resolve));

describe('part page runs', () => {
  it('starts a run once enough pages wait, one at a time, at most a full run, and the rest when all are in', async () => {
    const r = heldRenderer();
    const collected: number[] = [];
    const runs = new PartPageRuns({ render: r.render, perRun: 5, minRun: 3, collect: () => collected.push(runs.written) });
    runs.add(page(1));
    runs.add(page(2));
    expect(r.runs).toHaveLength(0);
    runs.add(page(3));
    expect(r.runs.map((x) => x.ids)).toEqual([['P1', 'P2', 'P3']]);
    // Pages that come during a run wait for it to end; then up to a full run of them goes.
    for (let n = 4; n <= 10; n++) runs.add(page(n));
    expect(r.runs).toHaveLength(1);
    r.runs[0].end();
    await settle();
    expect(r.runs.map((x) => x.ids)).toEqual([['P1', 'P2', 'P3'], ['P4', 'P5', 'P6', 'P7', 'P8']]);
    r.runs[1].end();
    await settle();
    // Two pages wait: fewer than a run's start, until every page is in.
    expect(r.runs).toHaveLength(2);
    // 3 + 5 pages rendered: one full run's worth, with more to come, so the garbage is collected once.
    expect(collected).toEqual([8]);
    const done = runs.done();
    expect(r.runs.map((x) => x.ids)[2]).toEqual(['P9', 'P10']);
    r.runs[2].end();
    expect(await done).toBe(10);
    expect(runs.runs).toBe(3);
    expect(r.most()).toBe(1);
    // The last run is not followed by a collection: nothing more is rendered.
    expect(collected).toEqual([8]);
  });

  it('renders every page once, in runs no larger than a full run, whatever the order of arrival and flush', async () => {
    const seen: string[] = [];
    const runs = new PartPageRuns({
      render: async (pages) => {
        expect(pages.length).toBeLessThanOrEqual(4);
        await settle();
        seen.push(...pages.map((p) => p.id));
        return pages.length;
      },
      perRun: 4,
      minRun: 2,
      collect: () => undefined,
    });
    for (let n = 0; n < 23; n++) {
      runs.add(page(n));
      if (n % 3 === 0) await settle();
    }
    runs.flush();
    expect(await runs.done()).toBe(23);
    expect([...seen].sort()).toEqual(Array.from({ length: 23 }, (_, n) => `P${n}`).sort());
  });

  it('fails with the error of a failed run and starts no run after it', async () => {
    const r = heldRenderer();
    const runs = new PartPageRuns({ render: r.render, perRun: 2, minRun: 2, collect: () => undefined });
    runs.add(page(1));
    runs.add(page(2));
    runs.add(page(3));
    runs.add(page(4));
    r.runs[0].end(new Error('template broke'));
    await settle();
    expect(r.runs).toHaveLength(1);
    await expect(runs.done()).rejects.toThrow('template broke');
    expect(r.runs).toHaveLength(1);
  });

  it('settles by waiting for the run going and starting no other', async () => {
    const r = heldRenderer();
    const runs = new PartPageRuns({ render: r.render, perRun: 2, minRun: 1, collect: () => undefined });
    runs.add(page(1));
    runs.add(page(2));
    let settled = false;
    const settling = runs.settle().then(() => (settled = true));
    await settle();
    expect(settled).toBe(false);
    r.runs[0].end(new Error('ignored while abandoning'));
    await settling;
    expect(settled).toBe(true);
    expect(r.runs).toHaveLength(1);
  });

  it('renders the next run with the one started ahead, once, and starts none ahead without the option or once stopped', async () => {
    const r = heldRenderer();
    const started: string[][][] = [];
    const prepare = () => {
      const given: string[][] = [];
      started.push(given);
      return (pages: PartPageData[]) => {
        given.push(pages.map((p) => p.id));
        return r.render(pages);
      };
    };
    const runs = new PartPageRuns({ render: r.render, prepare, perRun: 5, minRun: 1 });
    runs.prepare();
    runs.prepare();
    expect(started).toHaveLength(1);
    runs.add(page(1));
    // The run started ahead took the page; the next run is a plain one.
    expect(started[0]).toEqual([['P1']]);
    r.runs[0].end();
    await settle();
    runs.add(page(2));
    expect(r.runs.map((x) => x.ids)).toEqual([['P1'], ['P2']]);
    expect(started[0]).toEqual([['P1']]);
    r.runs[1].end();
    expect(await runs.done()).toBe(2);

    const plain = new PartPageRuns({ render: heldRenderer().render });
    expect(() => plain.prepare()).not.toThrow();
    const stopped = new PartPageRuns({ render: r.render, prepare });
    await stopped.settle();
    stopped.prepare();
    expect(started).toHaveLength(1);
  });
});
