/** Installs a missing Debian package when this machine lets us (root or passwordless sudo). */
import { spawnSync } from 'node:child_process';

const isRoot = process.getuid?.() === 0;

function hasCommand(name: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

/** Whether installing is possible here; `LAGWISE_NO_INSTALL=1` forbids it. */
export function canInstallPackages(): boolean {
  if (process.env.LAGWISE_NO_INSTALL === '1' || !hasCommand('apt-get')) return false;
  return isRoot || spawnSync('sudo', ['-n', 'true'], { stdio: 'ignore' }).status === 0;
}

/** apt-get install, refreshing the package lists once if the first try fails. */
export function aptInstall(pkg: string): boolean {
  const command = isRoot ? 'apt-get' : 'sudo';
  const lead = isRoot ? [] : ['-n', 'apt-get'];
  const run = (args: string[]) =>
    spawnSync(command, [...lead, '-o', 'DPkg::Lock::Timeout=300', ...args], {
      stdio: 'inherit',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    }).status === 0;
  if (run(['install', '-y', pkg])) return true;
  run(['update']);
  return run(['install', '-y', pkg]);
}
