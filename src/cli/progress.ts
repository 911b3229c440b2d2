import type { Progress } from '../engine';

/** Progress on stderr, at most a few lines a second, so stdout stays clean for --json. */
export function stderrProgress(label: string): Progress {
  let last = 0;
  return (done, total, what) => {
    const now = Date.now();
    if (done < total && now - last < 500) return;
    last = now;
    const pct = total ? Math.round((100 * done) / total) : 100;
    process.stderr.write(`${label}: ${what} ${done}/${total} (${pct} %)\n`);
  };
}
