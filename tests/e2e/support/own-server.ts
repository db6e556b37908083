// An app server the test owns: its own `next start` on a spare port of the test profile, on the same
// database, photo folder and NEXTAUTH_SECRET as Playwright's, so a test can kill it and start it again.
import { spawn, type ChildProcess } from 'node:child_process';

export class OwnServer {
  private child: ChildProcess | undefined;
  readonly url: string;

  /** `env` adds to (or overrides) the test profile's environment, e.g. DB_READ_HOSTS. */
  constructor(
    readonly port: number,
    private readonly env: Record<string, string> = {},
  ) {
    this.url = `http://127.0.0.1:${port}`;
  }

  /** Starts `next start` and waits until /api/health answers. */
  async start(timeoutMs = 60_000): Promise<void> {
    const child = spawn(process.execPath, ['node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(this.port)], {
      env: { ...process.env, NODE_ENV: 'production', PORT: String(this.port), NEXTAUTH_URL: this.url, ...this.env },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    this.child = child;
    const started = Date.now();
    while (Date.now() - started < timeoutMs) {
      if (child.exitCode !== null) throw new Error(`the server on ${this.port} exited with ${child.exitCode}`);
      try {
        if ((await fetch(`${this.url}/api/health`)).ok) return;
      } catch {
        // not listening yet
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`${this.url} did not answer in ${timeoutMs / 1000} s`);
  }

  /** Kills the process (SIGKILL: no shutdown hooks, open transactions cut) and waits for its exit. */
  async kill(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    const child = this.child;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill(signal);
    await exited;
  }

  /** Stops the server gently (after the tests). */
  async stop(): Promise<void> {
    await this.kill('SIGTERM');
  }
}
