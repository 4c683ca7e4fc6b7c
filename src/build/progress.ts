// Progress on long work: a line redrawn in place on a terminal, plain occasional lines in CI or a pipe.

export interface Progress {
  /** A new stage with `total` steps ("parts", 1000); a stage of one step shows no count ("pages…", "pages: done"). */
  stage(name: string, total: number): void;
  tick(count?: number): void;
  /** A one-line message (summary, hint). */
  note(text: string): void;
}

export const silentProgress: Progress = { stage() {}, tick() {}, note() {} };

export function terminalProgress(write: (text: string) => void, interactive: boolean, now: () => number = () => performance.now()): Progress {
  let name = '';
  let total = 0;
  let done = 0;
  let started = 0;
  let lastDraw = 0;
  let lastPlainDecile = -1;
  const eta = () => {
    if (done === 0) return '';
    const seconds = ((now() - started) / 1000 / done) * (total - done);
    return seconds >= 1 ? `, about ${Math.ceil(seconds)} s left` : '';
  };
  const draw = (final: boolean) => {
    if (total <= 1) {
      // One step: a count of "0/1" or "1/1" says nothing. Its name as it starts (a plain line: the log shows
      // what a build is doing), and on a terminal that it ended.
      if (interactive) write(final ? `\r\x1b[2K${name}: done\n` : `\r\x1b[2K${name}…`);
      else if (!final) write(`${name}…\n`);
    } else if (interactive) {
      write(`\r\x1b[2K${name} ${done}/${total}${final ? '' : eta()}${final ? '\n' : ''}`);
    } else {
      // In CI or a pipe: one line at each tenth, so logs stay short.
      const decile = total === 0 ? 10 : Math.floor((done / total) * 10);
      if (decile !== lastPlainDecile && (final || decile > lastPlainDecile)) {
        lastPlainDecile = decile;
        if (final || decile > 0) write(`${name} ${done}/${total}\n`);
      }
    }
  };
  return {
    stage(stageName, stageTotal) {
      name = stageName;
      total = stageTotal;
      done = 0;
      started = now();
      lastDraw = 0;
      lastPlainDecile = -1;
      if (interactive || total <= 1) draw(false);
    },
    tick(count = 1) {
      done += count;
      const t = now();
      if (done >= total) draw(true);
      else if (!interactive || t - lastDraw > 100) {
        lastDraw = t;
        draw(false);
      }
    },
    note(text) {
      write(`${text}\n`);
    },
  };
}
