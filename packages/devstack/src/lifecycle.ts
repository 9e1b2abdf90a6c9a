import { describeExit, type Service } from './processes.ts';

type Cleanup = { name: string; run: () => Promise<void> };

/**
 * One way out for an orchestrator: a signal, a crashed child or a failed step all end in shutdown(),
 * which stops what was started (newest first) exactly once and then exits with the first caller's code.
 */
export class Lifecycle {
  private readonly cleanups: Cleanup[] = [];
  private ending: Promise<never> | null = null;
  /** Printed after everything has stopped, whatever the way out (npm test's Summary line). */
  finalLine: (() => string) | null = null;

  get stopping(): boolean {
    return this.ending !== null;
  }

  /** Registers something to stop at the end; if shutdown already began, stops it right away. */
  async add(name: string, run: () => Promise<void>): Promise<void> {
    if (this.ending !== null) {
      await run().catch((error: unknown) => process.stderr.write(`Could not stop ${name}: ${String(error)}\n`));
      return;
    }
    this.cleanups.push({ name, run });
  }

  /** Throws if shutdown began meanwhile, so a startup sequence does not carry on starting things. */
  assertRunning(): void {
    if (this.ending !== null) throw new Error('Stopping');
  }

  shutdown(code: number, message?: string): Promise<never> {
    if (this.ending !== null) return this.ending;
    if (message !== undefined) process.stderr.write(`${message}\n`);
    this.ending = (async () => {
      let exitCode = code;
      for (const cleanup of this.cleanups.splice(0).reverse()) {
        try {
          await cleanup.run();
        } catch (error) {
          process.stderr.write(`Could not stop ${cleanup.name}: ${String(error)}\n`);
          exitCode = exitCode === 0 ? 1 : exitCode;
        }
      }
      if (this.finalLine !== null) process.stdout.write(`${this.finalLine()}\n`);
      process.exit(exitCode);
    })();
    return this.ending;
  }

  /**
   * Ctrl-C, SIGTERM and a closed terminal stop everything and exit with signalCode; a bug of ours (an
   * uncaught error) still stops the servers it started, then exits 1.
   */
  handleSignals(signalCode: number, onSignal?: (signal: NodeJS.Signals) => void): void {
    const onBug = (error: unknown) => {
      process.stderr.write(
        `Unexpected error in the orchestrator: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
      );
      void this.shutdown(1);
    };
    process.on('uncaughtException', onBug);
    process.on('unhandledRejection', onBug);
    for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
      process.on(signal, () => {
        // npm forwards the terminal's SIGINT to us as well, so the same Ctrl-C can arrive twice.
        if (this.stopping) return;
        onSignal?.(signal);
        void this.shutdown(signalCode, `\n${signal} received: stopping…`);
      });
    }
  }

  /** A long-running child that exits on its own takes everything down with exit code 1. */
  watch(service: Service): void {
    void this.add(service.name, () => service.stop());
    void service.exited.then((info) => {
      if (this.stopping || service.stopRequested()) return;
      const lastLines = service.quiet
        ? `\nIts last lines (all of them in ${service.logFile ?? 'its log'}):\n${service.recentOutput().join('\n')}`
        : '';
      void this.shutdown(1, `${service.name} ${describeExit(info)} unexpectedly: stopping everything.${lastLines}`);
    });
  }
}
