/**
 * A PostgreSQL server from Debian's packages, run on loopback for the default start and the tests.
 * Own code because the registry's embedded-PostgreSQL packages download their own server builds,
 * which this project must not do: it drives the distribution's initdb/pg_ctl instead.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, chownSync, chmodSync } from 'node:fs';
import { join, resolve } from 'node:path';
import net from 'node:net';
import pg from 'pg';

const DEBIAN_PG_ROOT = '/usr/lib/postgresql';

export class PostgresSetupError extends Error {
  override name = 'PostgresSetupError';
}

function isRoot(): boolean {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

function commandExists(cmd: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
}

/** The folder holding initdb and pg_ctl, newest major version first; undefined when none is installed. */
export function findPostgresBinDir(): string | undefined {
  if (existsSync(DEBIAN_PG_ROOT)) {
    const versions = readdirSync(DEBIAN_PG_ROOT)
      .filter((v) => existsSync(join(DEBIAN_PG_ROOT, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    if (versions[0]) return join(DEBIAN_PG_ROOT, versions[0], 'bin');
  }
  if (commandExists('pg_config')) {
    const bindir = spawnSync('pg_config', ['--bindir'], { encoding: 'utf8' }).stdout.trim();
    if (bindir && existsSync(join(bindir, 'initdb'))) return bindir;
  }
  return undefined;
}

/**
 * Finds the server binaries, installing Debian's `postgresql` package when running as root with apt.
 * Otherwise throws with the exact command to run.
 */
export function ensurePostgresBinaries(log: (line: string) => void = console.log): string {
  const found = findPostgresBinDir();
  if (found) return found;
  if (isRoot() && commandExists('apt-get')) {
    log('PostgreSQL server binaries not found: installing Debian package postgresql (apt-get)...');
    const run = (args: string[]) => {
      const r = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
      if (r.status !== 0) throw new PostgresSetupError(`apt-get ${args.join(' ')} failed; run it by hand: sudo apt-get update && sudo apt-get install -y postgresql`);
    };
    run(['update']);
    run(['install', '-y', 'postgresql']);
    const after = findPostgresBinDir();
    if (after) return after;
  }
  throw new PostgresSetupError(
    'PostgreSQL server binaries (initdb, pg_ctl) were not found. Install them with:\n\n    sudo apt-get update && sudo apt-get install -y postgresql\n\nor set DATABASE_URL to use a server you already run.',
  );
}

/** A free TCP port on 127.0.0.1, picked by the OS. */
export async function findFreePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolvePort(port));
    });
  });
}

export interface EmbeddedPostgresOptions {
  /** Folder of the cluster's files; created and initialised when missing. */
  dataDir: string;
  /** Folder of the Unix socket and lock file. */
  socketDir: string;
  port: number;
  /** Throwaway clusters for tests: no fsync, no full-page writes. */
  ephemeral?: boolean;
  log?: (line: string) => void;
}

/** One PostgreSQL cluster on 127.0.0.1, run as the `postgres` system user when we are root. */
export class EmbeddedPostgres {
  readonly dataDir: string;
  readonly socketDir: string;
  readonly port: number;
  private readonly ephemeral: boolean;
  private readonly log: (line: string) => void;
  private binDir = '';
  private startedByUs = false;

  constructor(options: EmbeddedPostgresOptions) {
    this.dataDir = resolve(options.dataDir);
    this.socketDir = resolve(options.socketDir);
    this.port = options.port;
    this.ephemeral = options.ephemeral ?? false;
    this.log = options.log ?? console.log;
  }

  /** The URL of a database on this server (user `postgres`, trust auth on loopback). */
  url(database: string): string {
    return `postgres://postgres@127.0.0.1:${this.port}/${database}`;
  }

  private run(binary: string, args: string[]): string {
    const path = join(this.binDir, binary);
    const [cmd, fullArgs] = isRoot() ? ['runuser', ['-u', 'postgres', '--', path, ...args]] : [path, args];
    try {
      return execFileSync(cmd, fullArgs as string[], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    } catch (error) {
      const e = error as { stderr?: string; stdout?: string; message: string };
      throw new PostgresSetupError(`${binary} ${args.join(' ')} failed:\n${e.stderr || e.stdout || e.message}`);
    }
  }

  private prepareFolder(dir: string, mode: number): void {
    mkdirSync(dir, { recursive: true });
    if (isRoot()) {
      const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
      const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
      chownSync(dir, uid, gid);
      if (spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-w', dir]).status !== 0) {
        throw new PostgresSetupError(`The postgres user cannot reach ${dir}. Put the project (or GNOMON_DATA_DIR) in a folder every user can enter, not under /root.`);
      }
    }
    chmodSync(dir, mode);
  }

  private isRunning(): boolean {
    if (!existsSync(join(this.dataDir, 'postmaster.pid'))) return false;
    const path = join(this.binDir, 'pg_ctl');
    const [cmd, args] = isRoot() ? ['runuser', ['-u', 'postgres', '--', path, '-D', this.dataDir, 'status']] : [path, ['-D', this.dataDir, 'status']];
    return spawnSync(cmd, args as string[], { stdio: 'ignore' }).status === 0;
  }

  /** Initialises the cluster if needed and starts it; reuses a server already running on the folder. */
  async start(): Promise<void> {
    this.binDir = ensurePostgresBinaries(this.log);
    this.prepareFolder(this.socketDir, 0o755);
    if (!existsSync(join(this.dataDir, 'PG_VERSION'))) {
      this.prepareFolder(this.dataDir, 0o700);
      this.log(`Initialising PostgreSQL cluster in ${this.dataDir}`);
      this.run('initdb', ['-D', this.dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8', '--no-sync']);
    }
    if (this.isRunning()) {
      this.log('PostgreSQL already running on this data folder: reusing it');
      return;
    }
    const serverOptions = [`-c listen_addresses=127.0.0.1`, `-p ${this.port}`, `-k ${this.socketDir}`];
    if (this.ephemeral) serverOptions.push('-c fsync=off -c synchronous_commit=off -c full_page_writes=off');
    this.run('pg_ctl', ['-D', this.dataDir, '-l', join(this.dataDir, 'server.log'), '-w', '-t', '60', '-o', serverOptions.join(' '), 'start']);
    this.startedByUs = true;
  }

  /** Creates the database when it does not exist yet. */
  async ensureDatabase(name: string): Promise<void> {
    if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new PostgresSetupError(`Invalid database name: ${name}`);
    const client = new pg.Client({ connectionString: this.url('postgres') });
    await client.connect();
    try {
      const exists = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
      if (exists.rowCount === 0) await client.query(`CREATE DATABASE ${name}`);
    } finally {
      await client.end();
    }
  }

  /** Stops the server if this object started it (fast shutdown: open sessions are ended). */
  async stop(): Promise<void> {
    if (!this.startedByUs) return;
    this.startedByUs = false;
    // Ctrl-C in a terminal also reaches the postmaster, which then shuts down on its own.
    if (!this.isRunning()) return;
    this.run('pg_ctl', ['-D', this.dataDir, '-m', 'fast', '-w', 'stop']);
  }
}
