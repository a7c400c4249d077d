/** A plain text progress bar on stderr, redrawn in place. */
export function progressBar(label: string, total: number, stream: NodeJS.WriteStream = process.stderr): { update(done: number, note?: string): void; end(note?: string): void } {
  const started = Date.now();
  const width = 30;
  const draw = (done: number, note: string, last: boolean) => {
    const share = total === 0 ? 1 : Math.min(1, done / total);
    const filled = Math.round(share * width);
    const seconds = Math.round((Date.now() - started) / 1000);
    const line = `${label} [${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${String(Math.round(share * 100)).padStart(3)}%  ${Math.floor(seconds / 60)}m${String(seconds % 60).padStart(2, '0')}s  ${note}`;
    stream.write(stream.isTTY ? `\r${line}\x1b[K${last ? '\n' : ''}` : `${line}\n`);
  };
  let lastDraw = 0;
  return {
    update(done, note = '') {
      // Redraw at most a few times a second; a log file gets a line every few seconds.
      const every = stream.isTTY ? 200 : 5000;
      if (Date.now() - lastDraw < every) return;
      lastDraw = Date.now();
      draw(done, note, false);
    },
    end(note = '') {
      draw(total, note, true);
    },
  };
}
