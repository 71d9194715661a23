import type { DataSource } from 'typeorm';
import type { AppConfig } from '../config.js';
import type { Mailer } from './mail.js';

/** What routers and services are built from; tests pass their own. */
export interface AppDeps {
  dataSource: DataSource;
  mailer: Mailer;
  config: AppConfig;
}
