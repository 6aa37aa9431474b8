/**
 * Starts the server: one port for the API and the web app; in demo mode also the OAuth
 * stand-in and the mail catcher on loopback. Graceful shutdown on SIGINT/SIGTERM (stop
 * accepting, finish open requests, close pools and helpers).
 */
import type { Server } from 'node:http';
import { createApp } from './app';
import { listenOn } from './http/listen';
import { startStandIn, type StandIn } from './auth/stand-in';
import { warmUp } from './compute/warm-up';
import { loadConfig, type Config } from './config';
import type { AppContext } from './context';
import { createDb } from './db';
import { startJobs, type Jobs } from './jobs/boss';
import { allHandlers, registerSchedules } from './jobs/handlers';
import { startMailCatcher, type MailCatcher } from './mail/catcher';
import { ensureDemoAccounts, ensureFirstAdmin } from './people/service';

export interface Running {
  server: Server;
  jobs: Jobs;
  ctx: AppContext;
  url: string;
  close(): Promise<void>;
}

export async function startServer(config: Config = loadConfig()): Promise<Running> {
  const db = createDb(config.databaseUrl);
  await ensureFirstAdmin(db, config.firstAdminEmail);
  let standIn: StandIn | null = null;
  let catcher: MailCatcher | null = null;
  if (config.mode === 'demo') {
    await ensureDemoAccounts(db);
    standIn = await startStandIn(config.standInPort!);
    if (!config.smtpUrl) catcher = await startMailCatcher(db, config.mailCatcherPort);
  }
  const jobs = await startJobs({
    databaseUrl: config.databaseUrl,
    expireInSeconds: config.jobExpireSeconds,
    pollingIntervalSeconds: config.jobPollSeconds,
    maintenanceIntervalSeconds: config.jobMaintenanceSeconds,
    schedule: true,
  });
  const app = createApp({ db, config, jobs });
  const ctx: AppContext = app.locals.ctx;
  // Its fitting threads warmed before it takes a run's chunks (api/compute/warm-up.ts).
  await warmUp(ctx.compute);
  await jobs.work(allHandlers(ctx));
  await registerSchedules(ctx, jobs);
  const server = await listenOn(app, config.port, config.host);
  const url = `http://${config.host}:${config.port}`;
  let closing: Promise<void> | null = null;
  const close = () =>
    (closing ??= (async () => {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeIdleConnections();
        setTimeout(() => server.closeAllConnections(), 5_000).unref();
      });
      await jobs.stop();
      await app.locals.close();
      await standIn?.stop();
      await catcher?.stop();
      await db.destroy();
    })());
  return { server, jobs, ctx, url, close };
}

export function closeOnSignals(running: Running): void {
  const onSignal = (signal: NodeJS.Signals) => {
    process.stderr.write(`${signal} received: shutting down\n`);
    running.close().then(
      () => process.exit(0),
      (err) => {
        process.stderr.write(`shutdown failed: ${err}\n`);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
}

if (require.main === module) {
  Promise.resolve()
    .then(() => {
      const config = loadConfig();
      // The first log line says when the demo runs because nothing chose a mode.
      if (config.modeNotice) console.log(config.modeNotice);
      return startServer(config);
    })
    .then((running) => {
      closeOnSignals(running);
      console.log(`Crestwatch is serving on ${running.url}`);
    })
    .catch((err: Error) => {
      console.error(`Crestwatch could not start: ${err.message}`);
      process.exit(1);
    });
}
