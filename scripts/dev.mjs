// `npm run dev`: the server under tsx watch and the Angular dev server (proxying /api to it), together.
import { spawn } from 'node:child_process';

const env = { ...process.env, NG_CLI_ANALYTICS: 'false' };
const children = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/main.ts'], { stdio: 'inherit', env }),
  spawn('npx', ['ng', 'serve', '--port', '4200'], { stdio: 'inherit', env }),
];
console.log('client with live reload at http://localhost:4200 (API on PORT, default 4300)');

function stop() {
  for (const child of children) child.kill('SIGTERM');
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
for (const child of children) child.on('exit', () => { stop(); process.exitCode = 1; });
