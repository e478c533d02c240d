import { spawn, type ChildProcess } from 'node:child_process';

/** A Node child process for a benchmark (a server, a reference); resolves with what it prints after "READY ". */
export function child(nodeArgs: string[], env: NodeJS.ProcessEnv): Promise<{ proc: ChildProcess; line: string }> {
  const proc = spawn(process.execPath, nodeArgs, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    let out = '';
    proc.stdout!.on('data', (c) => {
      out += c;
      const m = /READY (\S+)/.exec(out);
      if (m) resolve({ proc, line: m[1] });
    });
    proc.once('exit', (code) => reject(new Error(`${nodeArgs.at(-1)} exited with ${code}`)));
  });
}
