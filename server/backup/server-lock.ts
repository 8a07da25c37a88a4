import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** A running server writes its process id here; restore refuses while that process lives. */
export const PID_FILE = 'server.pid';

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: it exists but belongs to someone else
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
};

/** The pid of a live server using `dataDir`, or null (a file left by a crash does not count). */
export function serverHolding(dataDir: string): number | null {
  const file = path.join(dataDir, PID_FILE);
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, 'utf8').trim());
  return Number.isInteger(pid) && pid > 0 && alive(pid) ? pid : null;
}

export function claimDataDir(dataDir: string) {
  writeFileSync(path.join(dataDir, PID_FILE), `${process.pid}\n`);
  return () => rmSync(path.join(dataDir, PID_FILE), { force: true });
}
