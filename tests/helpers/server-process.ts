// Starts the real server (node --import tsx server/index.ts) as a child process
// and resolves with its URL once it says it is running. Used by the browser
// tests, the crash test and the benchmarks.
import { type ChildProcess, spawn } from 'node:child_process';

export type ServerProcess = { child: ChildProcess; url: string };

export function startServerProcess(
  env: Record<string, string>,
  timeoutMs = 120_000,
  nodeArgs: string[] = [],
): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', ...nodeArgs, 'server/index.ts'], {
    env: { ...process.env, NODE_ENV: 'development', PORT: '0', MAIL_CATCHER_PORT: '0', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${output}`)), timeoutMs);
    const onData = (buf: Buffer) => {
      output += buf.toString();
      const m = output.match(/running at (http:\/\/localhost:\d+)/);
      if (m) {
        clearTimeout(timer);
        resolve({ child, url: m[1] });
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', onData);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with ${code}:\n${output}`));
    });
  });
}
