import { readFileSync } from 'node:fs';

/** Samples a process's resident memory (VmRSS from /proc, Linux) every intervalMs until stopped. */
export function sampleRss(pid: number, intervalMs = 500) {
  let maxKiB = 0;
  let windowMaxKiB = 0;
  let lastKiB = 0;
  let samples = 0;
  const read = () => {
    try {
      const kiB = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
      if (kiB > 0) {
        samples += 1;
        lastKiB = kiB;
        maxKiB = Math.max(maxKiB, kiB);
        windowMaxKiB = Math.max(windowMaxKiB, kiB);
      }
    } catch {
      // the process has gone
    }
  };
  read();
  const timer = setInterval(read, intervalMs);
  timer.unref();
  const mib = (kiB: number) => Math.round(kiB / 102.4) / 10;
  return {
    /** The peak since the last call (or the start), in MiB; the next window starts at the current figure. */
    windowPeakMiB() {
      read();
      const peak = mib(windowMaxKiB);
      windowMaxKiB = lastKiB;
      return peak;
    },
    stop() {
      clearInterval(timer);
      read();
      return { maxMiB: mib(maxKiB), lastMiB: mib(lastKiB), samples };
    },
  };
}
