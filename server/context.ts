import type { Knex } from 'knex';
import type { AppConfig } from './config';
import { createLogger, safeError, type Logger } from './logger';
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
import { JobQueues } from './queue/job-queues';
import { createRunServices, type RunServices } from './services/runs';
import { createStationServices, type StationServices } from './services/stations';
import { createStudyServices, type StudyServices } from './services/studies';
import { createWaterServices, type WaterServices } from './services/water';
import type { CatchmentInputSource } from './services/runs/catchment-inputs';
import { ThreadBudget } from './services/thread-budget';

/** Everything the routes need, built once per app by `createContext` (tests and seeds build their own). */
export interface AppContext
  extends AuthServices, MailServices, BillingServices, MemberServices, CatchmentServices, GeodataServices, StationServices, WaterServices, LabServices, RunServices, StudyServices, BriefingServices {
  config: AppConfig;
  db: Knex;
  /** The structured log; requests, errors and background failures, never values (server/logger.ts). */
  logger: Logger;
  /** The worker threads the PDF, upload and geodata pools share (`config.workerThreads`). */
  threads: ThreadBudget;
  /** The job queues in Redis that worker processes (server/worker.ts) take simulations from. */
  queues: JobQueues;
  /**
   * At server start: queues again the jobs of runs still open (idempotent), ends as failed the lab
   * jobs the queue no longer has and the batches of outlines an earlier process left being derived,
   * and starts a thread per pool.
   */
  start(): Promise<void>;
  /**
   * Waits for batches of outlines being derived (at most `graceMs`, after which those left end
   * failed with the restart message; without it, until they end), then stops the worker threads,
   * the queue connections and the mail transport. Runs and lab jobs stay queued or running: the
   * workers go on with them. The database stays open.
   */
  close(graceMs?: number): Promise<void>;
}

export interface ContextOptions {
  /** bcrypt work factor; 12 in production, 10 elsewhere, lower in tests to keep them quick. */
  bcryptCost?: number;
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
  const queues = new JobQueues(config.queue, (error) => logger.warn({ err: safeError(error) }, 'job queue unreachable'));
  const waterServices = createWaterServices({ bands: catchmentServices.bands });
  const labServices = createLabServices({ db, bands: catchmentServices.bands, queues, workerThreads: config.workerThreads, water: waterServices });
  const runServices = createRunServices({
    db, bands: catchmentServices.bands, calibrations: labServices.lab.calibrations, queues, water: waterServices, catchmentInputs: options.catchmentInputs,
  });
  const studyServices = createStudyServices({ ...runServices, ...geodataServices, db, logger });
  const briefingServices = createBriefingServices({
    results: runServices.results, studyResults: studyServices.studyResults, invitations: memberServices.invitations, mail: mailServices.mail, publicUrl: () => config.publicUrl,
    threads, briefingResults: options.briefingResults,
  });
  const pools = [briefingServices.pdfPool, catchmentServices.uploads.pool];
  return {
    config,
    db,
    logger,
    threads,
    queues,
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
    ...studyServices,
    ...briefingServices,
    async start() {
      // Runs live in the database and the queue: their jobs are added again where one was lost.
      await runServices.runQueue.recover();
      // Lab jobs are carried out by the workers too; only one whose queue job was lost cannot go on.
      // A batch of outlines being derived is driven from the process that started it: one left running cannot resume.
      await labServices.lab.jobs.recover();
      await studyServices.outlineBatches.derivation.recover();
      for (const pool of pools) pool.warm();
    },
    async close(graceMs?: number) {
      if (graceMs === undefined) await studyServices.outlineBatches.derivation.idle();
      else await studyServices.outlineBatches.derivation.stop(graceMs);
      // The geodata pool is not warmed: its threads start with the first upload.
      await Promise.all([...pools, geodataServices.geodata.pool].map((pool) => pool.close()));
      await queues.close();
      mailServices.mail.close();
    },
  };
}
