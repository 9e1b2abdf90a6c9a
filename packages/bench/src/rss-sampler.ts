import { readFileSync } from 'node:fs';

/** Samples a process's resident memory (VmRSS from /proc, Linux) every intervalMs until stopped. */
export function sampleRss(pid: number, intervalMs = 500) {
  let maxKiB = 0;
  let lastKiB = 0;
  let samples = 0;
  const read = () => {
    try {
      const kiB = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
      if (kiB > 0) {
        samples += 1;
        lastKiB = kiB;
        maxKiB = Math.max(maxKiB, kiB);
      }
    } catch {
      // the process has gone
    }
  };
  read();
  const timer = setInterval(read, intervalMs);
  timer.unref();
  return {
    stop() {
      clearInterval(timer);
      read();
      return { maxMiB: Math.round(maxKiB / 102.4) / 10, lastMiB: Math.round(lastKiB / 102.4) / 10, samples };
    },
  };
}
