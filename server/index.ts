import { loadEnv } from './config/env';
import { boot } from './boot';

/** Entry point: start everything, and shut down gracefully on SIGTERM or SIGINT. */
const running = await boot(loadEnv());
for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.once(signal, () => {
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
