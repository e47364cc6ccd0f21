// The scaled layout as a function, shared by `npm run start:scaled` and `npm run soak`: `webCount` web processes (no
// jobs), one worker process (the queue: builds, PDFs, renditions, mail), each the built server on its own loopback
// port, and the front port over the web processes. A process that stops without being asked is started again on the
// same port (so the front port's list never changes), after a back-off that doubles from 0.5 s to 8 s while it keeps
// failing; the front port takes it back once its health answers.
import type { ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { startFrontProxy, type FrontProxy } from './front-proxy';
import { freePort } from './postgres';
import { startServer, type ServerEnv } from './prepare';

export type ScaledRole = 'web' | 'worker';

export interface ScaledProcess {
  role: ScaledRole;
  /** 1-based within its role. */
  n: number;
  port: number;
  logFile: string;
  /** The running child (replaced when it is started again). */
  child: ChildProcess;
  /** How many times the supervisor started it again. */
  restarts: number;
}

export interface ScaledLayout {
  front: FrontProxy;
  processes: ScaledProcess[];
  /** Resolves when `proc` has been started again by the supervisor after it stopped (or at once if it runs). */
  running(proc: ScaledProcess): Promise<void>;
  /** Stop every process (SIGTERM, then SIGKILL after 5 s) and close the front port. */
  stop(): Promise<void>;
}

export interface ScaledOptions {
  webCount: number;
  /** Everything the servers share; host, port and the role settings are the layout's own. */
  server: Omit<ServerEnv, 'host' | 'port' | 'trustedProxies'>;
  front: { host: string; port: number };
  logsDir: string;
  /** Start a process again when it stops unasked (default true). */
  restart?: boolean;
  /** Lines for people: a process stopped, started again, left or rejoined the rotation. */
  say?: (line: string) => void;
}

const RESTART_FIRST_MS = 500;
const RESTART_LONGEST_MS = 8000;
/** A process that ran this long without stopping starts its back-off again from the first step. */
const RESTART_SETTLED_MS = 60_000;

export async function startScaledLayout(opts: ScaledOptions): Promise<ScaledLayout> {
  const say = opts.say ?? (() => undefined);
  const processes: ScaledProcess[] = [];
  const waiting = new Map<ScaledProcess, (() => void)[]>();
  let stopping = false;

  const start = (role: ScaledRole, port: number, logFile: string) =>
    startServer(
      {
        ...opts.server,
        host: '127.0.0.1',
        port,
        // The front port adds X-Forwarded-For; only loopback (the front port itself) is believed.
        trustedProxies: '127.0.0.1',
        settings: { ...opts.server.settings, PROCESS_ROLE: role, QUEUE_WORKER: role === 'worker' ? 'true' : 'false' },
      },
      { logFile },
    );

  function watch(proc: ScaledProcess, delay = RESTART_FIRST_MS) {
    const startedAt = Date.now();
    proc.child.once('exit', (code, signal) => {
      if (stopping) return;
      const why = signal ?? `code ${code}`;
      if (opts.restart === false) {
        say(`the ${proc.role} process on port ${proc.port} stopped (${why}); nothing restarts it.`);
        return;
      }
      const wait = Date.now() - startedAt > RESTART_SETTLED_MS ? RESTART_FIRST_MS : delay;
      say(`the ${proc.role} process on port ${proc.port} stopped (${why}); starting it again in ${(wait / 1000).toFixed(1)} s`);
      const again = async () => {
        if (stopping) return;
        try {
          proc.child = await start(proc.role, proc.port, proc.logFile);
          proc.restarts++;
          say(`the ${proc.role} process on port ${proc.port} is running again (pid ${proc.child.pid})`);
          for (const done of waiting.get(proc) ?? []) done();
          waiting.delete(proc);
          watch(proc, Math.min(wait * 2, RESTART_LONGEST_MS));
        } catch (err) {
          const longer = Math.min(wait * 2, RESTART_LONGEST_MS);
          say(`the ${proc.role} process on port ${proc.port} did not start (${(err as Error).message}); trying again in ${(longer / 1000).toFixed(1)} s`);
          setTimeout(again, longer);
        }
      };
      setTimeout(again, wait);
    });
  }

  async function launch(role: ScaledRole, n: number) {
    const port = await freePort();
    const logFile = join(opts.logsDir, `${role}-${n}.log`);
    const proc: ScaledProcess = { role, n, port, logFile, child: await start(role, port, logFile), restarts: 0 };
    processes.push(proc);
    watch(proc);
  }

  const stop = async () => {
    stopping = true;
    await front?.close();
    await Promise.all(
      processes.map(async ({ child }) => {
        if (child.exitCode !== null || child.signalCode !== null) return;
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      }),
    );
  };

  let front: FrontProxy | undefined;
  try {
    await launch('worker', 1);
    for (let i = 1; i <= opts.webCount; i++) await launch('web', i);
    front = await startFrontProxy({
      host: opts.front.host,
      port: opts.front.port,
      targets: processes.filter((p) => p.role === 'web').map((p) => p.port),
      onRotation: (port, inRotation, why) => say(`the web process on port ${port} ${inRotation ? 'is back in' : 'left'} the rotation (${why})`),
    });
  } catch (err) {
    await stop();
    throw err;
  }

  return {
    front,
    processes,
    running: (proc) =>
      proc.child.exitCode === null && proc.child.signalCode === null
        ? Promise.resolve()
        : new Promise<void>((done) => waiting.set(proc, [...(waiting.get(proc) ?? []), done])),
    stop,
  };
}
