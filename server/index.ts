import { loadConfig } from './config';
import { startWearcourse } from './main';

const config = loadConfig();
const running = await startWearcourse(config);
let stopping = false;
const shutdown = (signal: string) => {
  if (stopping) return;
  stopping = true;
  console.log(`${signal}: stopping Wearcourse…`);
  running.server.closeAllConnections?.();
  running.stop().then(
    () => process.exit(0),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
};
process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
