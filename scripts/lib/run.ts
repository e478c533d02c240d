import { spawn } from 'node:child_process';

/** Runs a command with inherited output; resolves with its exit code. */
export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', env });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(127));
  });
}

export const bin = (name: string) => `node_modules/.bin/${name}`;
