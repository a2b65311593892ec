// Runs a private PostgreSQL cluster for Groundwork: installed from Debian's packages when
// absent, owned by the `postgres` user (PostgreSQL refuses to run as root), listening on
// 127.0.0.1 only, on a port of our own.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, writeFileSync, chmodSync, rmSync } from 'node:fs';
import { dirname, join } from 'node:path';
import net from 'node:net';

const isRoot = process.getuid?.() === 0;

/** Finds initdb/pg_ctl under /usr/lib/postgresql/<major>/bin (the major differs by Debian release). */
export function findPgBin() {
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return null;
  const majors = readdirSync(root)
    .filter((d) => existsSync(join(root, d, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return majors.length ? join(root, majors[0], 'bin') : null;
}

/** Installs Debian's postgresql package when no server binaries are present. */
export function ensurePostgresInstalled(log) {
  let bin = findPgBin();
  if (bin) return bin;
  if (!isRoot) throw new Error('PostgreSQL is not installed and we are not root: run `sudo apt-get install -y postgresql`.');
  log('Installing PostgreSQL from Debian packages (one time)…');
  execFileSync('apt-get', ['update'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  bin = findPgBin();
  if (!bin) throw new Error('PostgreSQL installed but no initdb found under /usr/lib/postgresql/*/bin.');
  return bin;
}

function asPostgres(cmd, args, opts = {}) {
  const full = isRoot ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];
  return spawnSync(full[0], full[1], { encoding: 'utf8', ...opts });
}

/** True when the `postgres` user can reach and write the folder's parent chain. */
function postgresCanUse(dir) {
  if (!isRoot) return true;
  // `test -x` on the parent fails when any folder above it is closed to the postgres user.
  const r = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dirname(dir)]);
  return r.status === 0;
}

/**
 * Makes sure a cluster exists in dataDir, with a password for the `postgres` role.
 * @example ensureCluster({ bin, dataDir: '.data/pg', password: 'x' })
 */
export function ensureCluster({ bin, dataDir, password, log }) {
  if (existsSync(join(dataDir, 'PG_VERSION'))) return;
  mkdirSync(dataDir, { recursive: true });
  if (isRoot) execFileSync('chown', ['-R', 'postgres:postgres', dataDir]);
  const pwfile = join(dataDir, '..', `.pw-${process.pid}`);
  writeFileSync(pwfile, password + '\n', { mode: 0o644 });
  log?.(`Creating a PostgreSQL cluster in ${dataDir}…`);
  const r = asPostgres(join(bin, 'initdb'), [
    '-D', dataDir, '-U', 'postgres', '--auth=scram-sha-256', `--pwfile=${pwfile}`, '-E', 'UTF8', '--locale=C.UTF-8',
  ]);
  rmSync(pwfile, { force: true });
  if (r.status !== 0) throw new Error(`initdb failed:\n${r.stdout}\n${r.stderr}`);
}

async function portAnswers(port) {
  return new Promise((resolve) => {
    const s = net.connect({ host: '127.0.0.1', port }, () => {
      s.destroy();
      resolve(true);
    });
    s.on('error', () => resolve(false));
  });
}

/** Starts the cluster on 127.0.0.1:port unless it is already running. Returns true if we started it. */
export async function startCluster({ bin, dataDir, port, log, durable = true }) {
  const status = asPostgres(join(bin, 'pg_ctl'), ['-D', dataDir, 'status']);
  if (status.status === 0) return false;
  if (await portAnswers(port)) {
    throw new Error(`Port ${port} is taken by another program: set PGPORT to a free port.`);
  }
  const logFile = join(dataDir, 'server.log');
  const r = asPostgres(join(bin, 'pg_ctl'), [
    '-D', dataDir, '-l', logFile, '-w', '-t', '60',
    '-o', `-c listen_addresses=127.0.0.1 -p ${port} -c unix_socket_directories=''${durable ? '' : ' -c fsync=off -c synchronous_commit=off -c full_page_writes=off'}`,
    'start',
  ]);
  if (r.status !== 0) throw new Error(`PostgreSQL did not start:\n${r.stdout}\n${r.stderr}`);
  log?.(`PostgreSQL listening on 127.0.0.1:${port}`);
  return true;
}

export function stopCluster({ bin, dataDir }) {
  asPostgres(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
}

/** Picks a data folder the postgres user can use: the wanted one, else one under /tmp. */
export function usableDataDir(wanted, fallbackName) {
  mkdirSync(dirname(wanted), { recursive: true });
  if (postgresCanUse(wanted)) return wanted;
  return join('/tmp', fallbackName);
}

export { portAnswers };
