import { loadEnv } from './config/env';
import { boot } from './boot';
// The entry is the one file of server/ that knows seed/ (which sits above the server).
import { loadDemoData } from '../seed/load';

/** Entry point: start everything, and shut down gracefully on SIGTERM or SIGINT. */
const running = await boot(loadEnv(), console.log, { demoData: loadDemoData });
// `on`, not `once`: a second signal (Ctrl-C reaches both `npm start` and the server, which passes
// it on) must not kill the process while it finishes; `stop` runs once however often it is called.
for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.on(signal, () => {
    console.log(`${signal}: finishing requests under way, then closing the database.`);
    running.stop().then(
      () => process.exit(0),
      (err) => {
        console.error(err);
        process.exit(1);
      },
    );
  });
}
