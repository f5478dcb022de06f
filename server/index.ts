// Entry point: reads the config, builds the context and app, listens, shuts down gracefully.
import { createServer } from 'node:http';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { createContext } from './context';
import { startJobs } from './jobs/scheduler';

let config;
try {
  config = loadConfig();
} catch (error) {
  if (error instanceof ConfigError) {
    process.stderr.write(
      `${error.message}\nFix the environment variables above and start again.\n`,
    );
    process.exit(1);
  }
  throw error;
}

const ctx = await createContext(config);
const app = createApp(ctx);
const server = createServer(app);
const stopJobs = config.jobsEnabled ? startJobs(ctx) : () => {};

server.on('error', (error: NodeJS.ErrnoException) => {
  ctx.logger.fatal(
    { err: error },
    error.code === 'EADDRINUSE'
      ? `port ${config.port} is already in use`
      : 'the HTTP server failed',
  );
  process.exit(1);
});

server.listen(config.port, config.host, () => {
  ctx.logger.info({ url: config.publicUrl }, 'Rindwise is listening');
});

let shuttingDown = false;
async function shutdown(signal: string) {
  if (shuttingDown) return;
  shuttingDown = true;
  ctx.logger.info({ signal }, 'shutting down');
  const forced = setTimeout(() => process.exit(1), 10_000);
  forced.unref();
  stopJobs();
  server.close();
  server.closeIdleConnections();
  try {
    await ctx.close();
  } catch (error) {
    ctx.logger.error({ err: error }, 'error while closing');
  }
  process.exit(0);
}

process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('unhandledRejection', (reason) => {
  ctx.logger.error({ err: reason }, 'unhandled promise rejection');
});
