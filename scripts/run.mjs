// Runs a command with inherited output; rejects with its exit code so scripts stop at the first failure.
import { spawn } from 'node:child_process';

export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      if (code === 0) resolve();
      else reject(new Error(`${command} ${args.join(' ')} ended with ${signal ?? `exit code ${code}`}`));
    });
  });
}
