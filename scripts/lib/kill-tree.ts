// kill -9 of a process we started, and of everything it started: a killed parent cannot close its Chromium.
// Shared by `npm run soak` and the build-crash test.
import { execFileSync, type ChildProcess } from 'node:child_process';

/** Every process under `pid` (a server's Chromium and Chromium's own children), deepest last. */
export function descendants(pid: number): number[] {
  let children: number[] = [];
  try {
    children = execFileSync('ps', ['-o', 'pid=', '--ppid', String(pid)], { encoding: 'utf8' }).split('\n').map(Number).filter(Boolean);
  } catch {
    // no children
  }
  return children.flatMap((c) => [c, ...descendants(c)]);
}

/** SIGKILL `child` and its descendants; resolves once the child has exited. */
export function killHard(child: ChildProcess): Promise<void> {
  const tree = descendants(child.pid!);
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  child.kill('SIGKILL');
  for (const pid of tree) {
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      // already gone
    }
  }
  return exited;
}
