// HAProxy as the load balancer in front of the app nodes: installed from Debian's packages when
// missing, configured from deploy/haproxy.cfg, run in the foreground as our child.
import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { log, root, startChild } from './stack.mjs';

/** The haproxy binary, installed with apt when it is not on the PATH. */
export function ensureHaproxy() {
  const found = spawnSync('sh', ['-c', 'command -v haproxy'], { encoding: 'utf8' });
  if (found.status === 0) return found.stdout.trim();
  if (process.getuid?.() !== 0) throw new Error('HAProxy is not installed and we are not root: run `sudo apt-get install -y haproxy`.');
  log('Installing HAProxy from Debian packages (one time)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'haproxy'], { stdio: 'inherit', env });
  return spawnSync('sh', ['-c', 'command -v haproxy'], { encoding: 'utf8' }).stdout.trim();
}

/**
 * Fills deploy/haproxy.cfg for a listen address and a list of nodes, writes it to `file`.
 * @example writeHaproxyConfig({ file: '.data/haproxy.cfg', listen: '127.0.0.1:4321', nodes: [{ name: 'node-a', port: 4331 }] })
 */
export function writeHaproxyConfig({ file, listen, nodes, checkInterval = '1s' }) {
  const template = readFileSync(join(root, 'deploy', 'haproxy.cfg'), 'utf8');
  const servers = nodes.map((n) => `    server ${n.name} ${n.host ?? '127.0.0.1'}:${n.port} check`).join('\n');
  const text = template.replace('{{LISTEN}}', listen).replace('{{CHECK_INTERVAL}}', checkInterval).replace('{{SERVERS}}', servers);
  writeFileSync(file, text);
  // Refuse a broken file before starting anything.
  const check = spawnSync(ensureHaproxy(), ['-c', '-q', '-f', file], { encoding: 'utf8' });
  if (check.status !== 0) throw new Error(`HAProxy refused ${file}:\n${check.stdout}${check.stderr}`);
  return file;
}

/** Starts HAProxy in the foreground (-db) as a child that stops with the rest. */
export function startHaproxy(file, { quiet = true } = {}) {
  return startChild('load balancer', ensureHaproxy(), ['-db', '-f', file], { quiet });
}
