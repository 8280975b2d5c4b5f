// Starting and stopping a server process for the tests: wait until its port answers, stop it with SIGTERM and
// wait for it to exit (never SIGKILL: an nginx master killed that way leaves its worker holding the port).
import { spawn, type ChildProcess } from 'node:child_process';
import { connect, createServer } from 'node:net';

/** A port of 127.0.0.1 that was free a moment ago. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

export function portAnswers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

export interface RunningProcess {
  child: ChildProcess;
  output(): string;
  stop(): Promise<void>;
}

/** Runs `command` in the foreground and resolves once `port` accepts connections. */
export async function startProcess(command: string, args: string[], port: number, what: string): Promise<RunningProcess> {
  const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  let exited: number | null | undefined;
  const exit = new Promise<void>((resolve) =>
    child.once('exit', (code) => {
      exited = code;
      resolve();
    }),
  );
  const deadline = Date.now() + 10_000;
  while (!(await portAnswers(port))) {
    if (exited !== undefined) throw new Error(`${what} exited (${exited}) before listening on ${port}:\n${output}`);
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      throw new Error(`${what} did not listen on ${port} within 10 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 20));
  }
  return {
    child,
    output: () => output,
    async stop() {
      if (exited !== undefined) return;
      child.kill('SIGTERM');
      const timeout = new Promise<'late'>((r) => setTimeout(() => r('late'), 15_000));
      if ((await Promise.race([exit, timeout])) === 'late') throw new Error(`${what} did not exit within 15 s of SIGTERM`);
      // The port is free once the process is gone; wait for the listener to close all the same.
      for (let i = 0; i < 100 && (await portAnswers(port)); i++) await new Promise((r) => setTimeout(r, 20));
    },
  };
}
