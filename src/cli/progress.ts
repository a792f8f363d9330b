/**
 * Progress on stderr. On a terminal: one line redrawn in place (at most ten times a second) with a
 * bar, done/total, rate and time left. Elsewhere (a pipe, CI): a plain line every few seconds.
 * Silent with --quiet.
 */
export interface Progress {
  update(done: number, total: number | null): void;
  /** Clears the live line (before other output). */
  finish(): void;
}

function clock(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return '–';
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const rest = String(s % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${rest}` : `${m}:${rest}`;
}

function describeProgress(done: number, total: number | null, elapsedSeconds: number, width = 24): string {
  const rate = elapsedSeconds > 0 ? done / elapsedSeconds : 0;
  const rateText = `${rate >= 10 ? rate.toFixed(0) : rate.toFixed(1)}/s`;
  if (total === null || total === 0) return `${done} replications · ${rateText}`;
  const share = Math.min(1, done / total);
  const filled = Math.round(share * width);
  const eta = rate > 0 ? (total - done) / rate : Infinity;
  return `[${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total} replications (${Math.floor(share * 100)} %) · ${rateText} · ${clock(eta)} left`;
}

export function createProgress(options: { quiet: boolean; stream?: NodeJS.WriteStream; intervalMs?: number }): Progress {
  const stream = options.stream ?? process.stderr;
  if (options.quiet) return { update() {}, finish() {} };
  const started = Date.now();
  const live = stream.isTTY === true;
  const interval = options.intervalMs ?? (live ? 100 : 5000);
  let last = 0;
  let drawn = false;
  return {
    update(done, total) {
      const now = Date.now();
      const finished = total !== null && done >= total;
      if (now - last < interval && !finished) return;
      last = now;
      const text = describeProgress(done, total, (now - started) / 1000);
      if (live) {
        stream.write(`\r${text}\x1b[K`);
        drawn = true;
      } else {
        stream.write(`jostle: ${text}\n`);
      }
    },
    finish() {
      if (live && drawn) stream.write('\r\x1b[K');
    },
  };
}
