import { spawn, type ChildProcess } from 'node:child_process';
import { accessSync, constants, createWriteStream, mkdirSync, readFileSync, type WriteStream } from 'node:fs';
import { createServer } from 'node:net';
import { delimiter, dirname, join } from 'node:path';
import { createInterface } from 'node:readline';
import { setTimeout as sleep } from 'node:timers/promises';
import { formatLogLine } from './log-format.ts';

// Debian puts mariadbd in /usr/sbin, which a non-root PATH often lacks.
const extraBinDirs = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin', '/sbin'];

export function findExecutable(name: string): string {
  const dirs = [...(process.env.PATH ?? '').split(delimiter).filter(Boolean), ...extraBinDirs];
  for (const dir of dirs) {
    const candidate = join(dir, name);
    try {
      accessSync(candidate, constants.X_OK);
      return candidate;
    } catch {
      // not in this folder
    }
  }
  throw new Error(
    `${name} is not installed (looked in PATH and ${extraBinDirs.join(', ')}). Run: bash packages/devstack/bin/prepare.sh`,
  );
}

// Children still up, and whether each leads its own process group.
const running = new Map<ChildProcess, boolean>();

// Last resort if this script dies with children still up (an uncaught error, process.exit).
process.on('exit', () => {
  for (const [child, detached] of running) {
    if (child.exitCode === null && child.signalCode === null && child.pid !== undefined) {
      try {
        process.kill(detached ? -child.pid : child.pid, 'SIGTERM');
      } catch {
        // already gone
      }
    }
  }
});

export interface CaptureResult {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs a short command and collects its output; never throws for a non-zero exit. */
export function capture(
  command: string,
  args: string[],
  options: { input?: string; env?: NodeJS.ProcessEnv; timeoutMs?: number } = {},
): Promise<CaptureResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      env: options.env ?? process.env,
      stdio: [options.input === undefined ? 'ignore' : 'pipe', 'pipe', 'pipe'],
      timeout: options.timeoutMs ?? 30_000,
    });
    let stdout = '';
    let stderr = '';
    child.stdout?.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr?.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code, signal) => resolve({ code: code ?? (signal ? 128 : 1), stdout, stderr }));
    // A child that exits without reading its input must not take us down with EPIPE.
    child.stdin?.on('error', () => undefined);
    child.stdin?.end(options.input);
  });
}

/**
 * Runs a one-shot step (migrate, build, vitest, playwright) with the terminal attached.
 * It stays in our process group so Ctrl-C reaches it directly.
 */
export function runStep(
  command: string,
  args: string[],
  options: { env?: NodeJS.ProcessEnv; cwd?: string } = {},
): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { env: options.env ?? process.env, cwd: options.cwd, stdio: 'inherit' });
    running.set(child, false);
    child.on('error', (error) => {
      running.delete(child);
      reject(error);
    });
    child.on('exit', (code, signal) => {
      running.delete(child);
      resolve(code ?? (signal ? 128 : 1));
    });
  });
}

/** Runs a TypeScript entry point as one node process (no npm or npx wrapper left behind). */
export function nodeTsArgs(file: string, args: string[] = []): string[] {
  return ['--import', 'tsx', file, ...args];
}

export interface ExitInfo {
  code: number | null;
  signal: NodeJS.Signals | null;
}

export interface Service {
  name: string;
  pid: number;
  exited: Promise<ExitInfo>;
  hasExited(): boolean;
  /** The last lines it printed, for a crash report when its output went only to the log file. */
  recentOutput(): string[];
  quiet: boolean;
  logFile: string | undefined;
  /** True once stop() was called: its exit after that is expected, not a crash. */
  stopRequested(): boolean;
  stop(timeoutMs?: number): Promise<void>;
}

function pipeLines(
  stream: NodeJS.ReadableStream,
  prefix: string,
  out: NodeJS.WritableStream,
  recent: string[],
  log?: WriteStream,
): void {
  const lines = createInterface({ input: stream, crlfDelay: Infinity });
  lines.on('line', (line) => {
    log?.write(`${line}\n`);
    recent.push(line);
    if (recent.length > 30) recent.shift();
    if (prefix !== '') out.write(`${prefix}${formatLogLine(line)}\n`);
  });
}

/**
 * Starts a long-running child in its own process group, so a Ctrl-C in the terminal reaches only the
 * orchestrator, which then stops the children in order. Output goes to the terminal with a prefix,
 * and to logFile when given (quiet: log only).
 */
export function startService(options: {
  name: string;
  command: string;
  args: string[];
  env: NodeJS.ProcessEnv;
  logFile?: string;
  quiet?: boolean;
}): Service {
  const child = spawn(options.command, options.args, {
    env: options.env,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  if (child.pid === undefined) throw new Error(`Could not start ${options.name} (${options.command}).`);
  running.set(child, true);
  let log: WriteStream | undefined;
  if (options.logFile !== undefined) {
    mkdirSync(dirname(options.logFile), { recursive: true });
    log = createWriteStream(options.logFile, { flags: 'w' });
  }
  const quiet = options.quiet === true && options.logFile !== undefined;
  const prefix = quiet ? '' : `[${options.name}] `;
  const recent: string[] = [];
  pipeLines(child.stdout, prefix, process.stdout, recent, log);
  pipeLines(child.stderr, prefix, process.stderr, recent, log);

  let done = false;
  let stopCalled = false;
  const exited = new Promise<ExitInfo>((resolve) => {
    child.on('exit', (code, signal) => {
      done = true;
      running.delete(child);
      resolve({ code, signal });
      log?.end();
    });
  });
  const pid = child.pid;

  async function stop(timeoutMs = 10_000): Promise<void> {
    stopCalled = true;
    if (done) return;
    const signalGroup = (signal: NodeJS.Signals) => {
      try {
        process.kill(-pid, signal);
      } catch {
        // the group is already gone
      }
    };
    signalGroup('SIGTERM');
    const timer = sleep(timeoutMs).then(() => 'timeout' as const);
    if ((await Promise.race([exited, timer])) === 'timeout') {
      process.stderr.write(`${options.name} did not stop within ${timeoutMs / 1000} s; killing it.\n`);
      signalGroup('SIGKILL');
      await exited;
    }
  }

  return {
    name: options.name,
    pid,
    exited,
    quiet,
    logFile: options.logFile,
    recentOutput: () => [...recent],
    hasExited: () => done,
    stopRequested: () => stopCalled,
    stop,
  };
}

export function describeExit(info: ExitInfo): string {
  return info.signal !== null ? `was killed by ${info.signal}` : `exited with code ${info.code ?? '?'}`;
}

/** Polls until check() returns true; throws with `what` in the message on timeout or when failEarly() names a reason. */
export async function waitUntil(
  what: string,
  check: () => Promise<boolean>,
  options: { timeoutMs: number; intervalMs?: number; failEarly?: () => string | null },
): Promise<void> {
  const deadline = Date.now() + options.timeoutMs;
  for (;;) {
    if (await check()) return;
    const reason = options.failEarly?.() ?? null;
    if (reason !== null) throw new Error(`${what}: ${reason}`);
    if (Date.now() > deadline) throw new Error(`${what}: still not ready after ${options.timeoutMs / 1000} s`);
    await sleep(options.intervalMs ?? 100);
  }
}

export async function httpAnswers200(url: string): Promise<boolean> {
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
    await response.body?.cancel();
    return response.status === 200;
  } catch {
    return false;
  }
}

/** True when nothing listens on host:port (so a server we start there will not clash). */
export function portIsFree(port: number, host = '127.0.0.1'): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer();
    // Only EADDRINUSE means taken; EADDRNOTAVAIL (no IPv6 here, say) means nobody can be there either.
    probe.once('error', (error: NodeJS.ErrnoException) => resolve(error.code !== 'EADDRINUSE'));
    probe.listen({ port, host, exclusive: true }, () => probe.close(() => resolve(true)));
  });
}

export async function assertPortsFree(ports: { port: number; what: string }[]): Promise<void> {
  for (const { port, what } of ports) {
    // A server bound to :: also takes 127.0.0.1, but one bound to ::1 only would not show there.
    const free = (await portIsFree(port, '127.0.0.1')) && (await portIsFree(port, '::1'));
    if (!free) {
      throw new Error(
        `Port ${port} (${what}) is already in use. Stop whatever holds it (ss -ltnp 'sport = :${port}') and try again.`,
      );
    }
  }
}

/** The end of a log file, for an error message; never throws. */
export function lastLines(file: string, count = 10): string {
  try {
    return readFileSync(file, 'utf8').trimEnd().split('\n').slice(-count).join('\n');
  } catch {
    return '(no log written)';
  }
}

export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
