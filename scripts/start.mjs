// `npm start`: build the client if needed, bundle the server, then run it. The server itself
// applies the migrations and seeds the demo data when the database is empty.
import { buildServer } from './build-server.mjs';
import { buildClientIfStale } from './client-build.mjs';

await buildClientIfStale();
await buildServer();
// Importing the bundle starts the server in this process, so signals reach it directly.
await import('../dist/server/main.mjs');
