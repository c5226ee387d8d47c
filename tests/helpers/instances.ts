import { type ChildProcess, spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';

const projectDir = resolve(fileURLToPath(new URL('../..', import.meta.url)));

/**
 * The server built as `npm run build` builds it, into a folder of this run's own inside
 * node_modules/.cache (so its npm imports resolve from the project's node_modules).
 */
export function buildServer(): { entry: string; remove(): void } {
  const outDir = join(projectDir, 'node_modules', '.cache', `sixfold-server-${randomBytes(4).toString('hex')}`);
  const res = spawnSync(process.execPath, ['scripts/build.mjs', 'server'], {
    cwd: projectDir,
    env: { ...process.env, OUT_DIR: outDir },
    encoding: 'utf8',
  });
  if (res.status !== 0) throw new Error(`server build failed: ${res.stderr}`);
  return { entry: join(outDir, 'index.js'), remove: () => rmSync(outDir, { recursive: true, force: true }) };
}

/** A database of its own on the test server, empty, dropped by `drop()`. */
export async function emptyDatabase(prefix: string): Promise<{ url: string; drop(): Promise<void> }> {
  const base = process.env.TEST_DATABASE_URL;
  if (!base) throw new Error('TEST_DATABASE_URL is not set');
  const name = `${prefix}_${randomBytes(5).toString('hex')}`;
  const admin = new pg.Client({ connectionString: base });
  await admin.connect();
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  const url = new URL(base);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    async drop() {
      const c = new pg.Client({ connectionString: base });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    },
  };
}

export interface Instance {
  url: string;
  /** everything it printed so far */
  output(): string;
  stop(): Promise<void>;
}

/** Starts the built server as a process of its own (PORT=0: a free port); resolves once it listens. */
export function startInstance(entry: string, env: Record<string, string>): Promise<Instance> {
  const child: ChildProcess = spawn(process.execPath, [entry], {
    cwd: projectDir,
    env: { PATH: process.env.PATH ?? '', HOST: '127.0.0.1', PORT: '0', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  const stop = () =>
    new Promise<void>((done) => {
      if (child.exitCode !== null || child.signalCode !== null) return done();
      child.once('exit', () => done());
      child.kill('SIGTERM');
    });
  return new Promise((resolveStart, reject) => {
    const timer = setTimeout(() => {
      void stop();
      reject(new Error(`the server did not start within 60 s:\n${out}`));
    }, 60_000);
    const onData = (chunk: Buffer) => {
      out += chunk.toString();
      const m = out.match(/Sixfold is running at (http:\/\/\S+)/);
      if (m) {
        clearTimeout(timer);
        resolveStart({ url: m[1], output: () => out, stop });
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', onData);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited with ${code}:\n${out}`));
    });
  });
}

/** Runs the built server expecting it to refuse to start; resolves with its exit code and output. */
export function runToExit(
  entry: string,
  env: Record<string, string>,
): Promise<{ code: number | null; output: string }> {
  const child = spawn(process.execPath, [entry], {
    cwd: projectDir,
    env: { PATH: process.env.PATH ?? '', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout.on('data', (c: Buffer) => {
    out += c.toString();
  });
  child.stderr.on('data', (c: Buffer) => {
    out += c.toString();
  });
  return new Promise((done) => child.once('exit', (code) => done({ code, output: out })));
}
