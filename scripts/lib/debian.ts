// Debian packages the machine needs: found, installed (as root, in one apt run), or named with the command to run.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

/** One package the project needs from Debian, and how to tell it is already there. */
export interface DebianNeed {
  /** Debian package name, e.g. "chromium". */
  pkg: string;
  /** What it is for, in a few words (printed when it has to be installed). */
  why: string;
  /** True when the package (or what we need of it) is present. */
  present: () => boolean;
  /** Where it is looked for, for messages. */
  where?: string;
}

/** Where PostgreSQL's server binaries are: Debian puts them under /usr/lib/postgresql/<major>/bin. */
export function postgresBinDir(base = '/usr/lib/postgresql'): string | null {
  if (!existsSync(base)) return null;
  const majors = readdirSync(base)
    .filter((d) => existsSync(join(base, d, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return majors.length ? join(base, majors[0], 'bin') : null;
}

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const GHOSTSCRIPT_PATH = '/usr/bin/gs';

export const POSTGRESQL: DebianNeed = {
  pkg: 'postgresql',
  why: 'the database',
  present: () => postgresBinDir() !== null,
  where: '/usr/lib/postgresql/*/bin/initdb',
};
export const CHROMIUM: DebianNeed = {
  pkg: 'chromium',
  why: 'the browser that prints PDFs',
  present: () => existsSync(CHROMIUM_PATH),
  where: CHROMIUM_PATH === '/usr/bin/chromium' ? CHROMIUM_PATH : `${CHROMIUM_PATH} (CHROMIUM_PATH)`,
};
export const GHOSTSCRIPT: DebianNeed = {
  pkg: 'ghostscript',
  why: 'print-ready vector logo files',
  present: () => existsSync(GHOSTSCRIPT_PATH),
  where: GHOSTSCRIPT_PATH,
};

/** Everything Plumbline needs from Debian; `npm start` and `npm test` both ensure all of it in one apt run. */
export const MACHINE_PACKAGES: DebianNeed[] = [POSTGRESQL, CHROMIUM, GHOSTSCRIPT];

export type InstallPlan =
  | { action: 'none'; missing: [] }
  | { action: 'install'; missing: string[]; commands: string[][] }
  | { action: 'refuse'; missing: string[]; message: string };

/** Pure decision: which packages are missing, and what to run (root) or tell the user (not root). */
export function planInstall(needs: readonly DebianNeed[], asRoot: boolean): InstallPlan {
  const missing = [...new Set(needs.filter((n) => !n.present()).map((n) => n.pkg))];
  if (missing.length === 0) return { action: 'none', missing: [] };
  if (!asRoot) {
    const whys = needs.filter((n) => missing.includes(n.pkg)).map((n) => `${n.pkg} (${n.why})`);
    return {
      action: 'refuse',
      missing,
      message:
        `Missing Debian package${missing.length > 1 ? 's' : ''}: ${whys.join(', ')}. ` +
        `Only root can install ${missing.length > 1 ? 'them' : 'it'}; run this once, then start again:\n` +
        `  sudo apt-get install -y --no-install-recommends ${missing.join(' ')}`,
    };
  }
  return {
    action: 'install',
    missing,
    commands: [
      ['apt-get', ...APT_OPTIONS, 'update'],
      ['apt-get', ...APT_OPTIONS, 'install', '-y', '--no-install-recommends', ...missing],
    ],
  };
}

/** apt waits for its own lock (another apt-get or dpkg running) instead of failing at once. */
const APT_OPTIONS = ['-q', '-o', 'DPkg::Lock::Timeout=300'];

const LOCK_TEXT = /Could not get lock|Unable to lock|is another process using it|Unable to acquire the dpkg frontend lock/i;

/** Run one apt command; retry (with a pause) while another process holds apt's lock. */
function runApt(argv: string[], opts: { attempts?: number; pauseMs?: number } = {}): void {
  const attempts = opts.attempts ?? 20;
  const pauseMs = opts.pauseMs ?? 15_000;
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (let i = 1; ; i++) {
    const run = spawnSync(argv[0], argv.slice(1), { env, stdio: ['ignore', 'inherit', 'pipe'], encoding: 'utf8' });
    if (run.stderr) process.stderr.write(run.stderr);
    if (run.status === 0) return;
    if (run.error) throw new Error(`${argv[0]} could not run: ${run.error.message}`);
    if (LOCK_TEXT.test(run.stderr ?? '') && i < attempts) {
      console.log(`  apt is busy (another install holds its lock); trying again in ${pauseMs / 1000} s…`);
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, pauseMs);
      continue;
    }
    throw new Error(`\`${argv.join(' ')}\` failed (exit ${run.status}); see the output above.`);
  }
}

/**
 * Make sure every package in `needs` is present. As root, install the missing ones with one apt run
 * (DEBIAN_FRONTEND=noninteractive, --no-install-recommends); otherwise throw a message naming them and the command.
 * Returns the packages it installed.
 */
export function ensureDebianPackages(
  needs: readonly DebianNeed[] = MACHINE_PACKAGES,
  opts: { asRoot?: boolean; log?: (line: string) => void } = {},
): string[] {
  const log = opts.log ?? ((line: string) => console.log(line));
  const plan = planInstall(needs, opts.asRoot ?? process.getuid?.() === 0);
  if (plan.action === 'none') return [];
  if (plan.action === 'refuse') throw new Error(plan.message);
  const started = Date.now();
  log(`  Installing Debian's ${plan.missing.join(', ')} (apt-get, once; needed for ${needs
    .filter((n) => plan.missing.includes(n.pkg))
    .map((n) => n.why)
    .join(', ')})…`);
  for (const cmd of plan.commands) runApt(cmd);
  const still = needs.filter((n) => plan.missing.includes(n.pkg) && !n.present()).map((n) => (n.where ? `${n.pkg} at ${n.where}` : n.pkg));
  if (still.length) throw new Error(`apt-get finished, but this is still not found: ${still.join(', ')}.`);
  log(`  Installed ${plan.missing.join(', ')} in ${((Date.now() - started) / 1000).toFixed(0)} s.`);
  return plan.missing;
}
