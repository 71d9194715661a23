import type { DataSource } from 'typeorm';
import type { AppConfig } from '../config.js';
import type { Mailer } from './mail.js';
import type { RunScheduler } from '../api/runs/run-scheduler.js';

/** What routers and services are built from; tests pass their own. */
export interface AppDeps {
  dataSource: DataSource;
  mailer: Mailer;
  config: AppConfig;
  scheduler: RunScheduler;
}
