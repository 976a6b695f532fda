import type { Knex } from 'knex';
import type { AppConfig } from './config';
import { createLogger, type Logger } from './logger';
import { createAuthServices, type AuthServices } from './services/auth';
import { createBillingServices, type BillingServices } from './services/billing';
import { createBriefingServices, type BriefingServices } from './services/briefings';
import type { BriefingResultsSource } from './services/briefings/comparison';
import { createCatchmentServices, type CatchmentServices } from './services/catchments';
import { createGeodataServices, type GeodataServices } from './services/geodata';
import { createLabServices, type LabServices } from './services/lab';
import { createMailServices, type MailServices } from './services/mail';
import type { MailInbox } from './services/mail/mail-catcher';
import { createMemberServices, type MemberServices } from './services/members';
import { createRunServices, type RunServices } from './services/runs';
import { createStationServices, type StationServices } from './services/stations';
import { createWaterServices, type WaterServices } from './services/water';
import type { CatchmentInputSource } from './services/runs/catchment-inputs';
import type { Simulator } from './services/runs/simulator';
import { ThreadBudget } from './services/thread-budget';

/** Everything the routes need, built once per app by `createContext` (tests and seeds build their own). */
export interface AppContext
  extends AuthServices, MailServices, BillingServices, MemberServices, CatchmentServices, GeodataServices, StationServices, WaterServices, LabServices, RunServices, BriefingServices {
  config: AppConfig;
  db: Knex;
  /** The structured log; requests, errors and background failures, never values (server/logger.ts). */
  logger: Logger;
  /** The worker threads the run, lab and PDF pools share (`config.workerThreads`). */
  threads: ThreadBudget;
  /** Marks work an earlier process left unfinished as failed and starts a thread per pool (server start). */
  start(): Promise<void>;
  /**
   * Waits for runs and lab jobs under way (at most `graceMs`, after which those left end failed with
   * the restart message; without it, until they end), then stops the worker threads and the mail
   * transport. The database stays open.
   */
  close(graceMs?: number): Promise<void>;
}

export interface ContextOptions {
  /** bcrypt work factor; 12 in production, 10 elsewhere, lower in tests to keep them quick. */
  bcryptCost?: number;
  /** Simulates run members (`{ threads; simulate() }`); the worker pool unless given. */
  simulator?: Simulator;
  /** Where run engine inputs come from; the catchment's stored data unless given. */
  catchmentInputs?: CatchmentInputSource;
  /** Where briefing numbers come from; finished runs unless given. */
  briefingResults?: BriefingResultsSource;
  /** The local mail catcher, when one runs beside the app (development and tests). */
  inbox?: MailInbox;
  /** The structured log; made from `config.log` unless given (the server shares it with the database pool). */
  logger?: Logger;
}

/** The composition root: every service built here, from the config, the database and the options. */
export function createContext(config: AppConfig, db: Knex, options: ContextOptions = {}): AppContext {
  const threads = new ThreadBudget(config.workerThreads);
  const logger = options.logger ?? createLogger(config.log);
  const authServices = createAuthServices({ config, db, bcryptCost: options.bcryptCost });
  const mailServices = createMailServices({ config, db, inbox: options.inbox });
  const memberServices = createMemberServices({ config, db, logger, auth: authServices.auth, mail: mailServices.mail });
  const catchmentServices = createCatchmentServices({ threads, uploadsPerOrganisation: config.uploads.perOrganisation });
  const geodataServices = createGeodataServices({ config, bands: catchmentServices.bands, threads });
  const waterServices = createWaterServices({ bands: catchmentServices.bands });
  const labServices = createLabServices({ db, bands: catchmentServices.bands, threads, water: waterServices });
  const runServices = createRunServices({
    config, db, bands: catchmentServices.bands, calibrations: labServices.lab.calibrations, threads, water: waterServices,
    simulator: options.simulator, catchmentInputs: options.catchmentInputs,
  });
  const briefingServices = createBriefingServices({
    results: runServices.results, invitations: memberServices.invitations, mail: mailServices.mail, publicUrl: () => config.publicUrl,
    threads, briefingResults: options.briefingResults,
  });
  const pools = [runServices.simulationPool, labServices.lab.pool, briefingServices.pdfPool, catchmentServices.uploads.pool];
  return {
    config,
    db,
    logger,
    threads,
    ...authServices,
    ...mailServices,
    ...createBillingServices({ config, db, logger }),
    ...memberServices,
    ...catchmentServices,
    ...geodataServices,
    ...createStationServices(catchmentServices),
    ...waterServices,
    ...labServices,
    ...runServices,
    ...briefingServices,
    async start() {
      // Runs and lab jobs left running cannot resume: their inputs were in the earlier process's memory.
      await runServices.runExecutor.recover();
      await labServices.lab.jobs.recover();
      for (const pool of pools) pool.warm();
    },
    async close(graceMs?: number) {
      if (graceMs === undefined) {
        await runServices.runExecutor.idle();
        await labServices.lab.jobs.idle();
      } else {
        // One deadline for both: they wait side by side.
        await Promise.all([runServices.runExecutor.stop(graceMs), labServices.lab.jobs.stop(graceMs)]);
      }
      // The geodata pool is not warmed: its threads start with the first upload.
      await Promise.all([...pools, geodataServices.geodata.pool].map((pool) => pool.close()));
      mailServices.mail.close();
    },
  };
}
