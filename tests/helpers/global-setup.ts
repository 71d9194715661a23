import fs from 'node:fs';
import { builtClientDir } from './built-client.js';

/**
 * Gives the run an id, so the browser tests build the client once per run however many files need it,
 * and removes that run's build when the run ends.
 */
export default function setup(): () => void {
  process.env.TALLYVOLT_TEST_RUN ??= `${process.pid}-${Date.now()}`;
  const runId = process.env.TALLYVOLT_TEST_RUN;
  return () => fs.rmSync(builtClientDir(runId), { recursive: true, force: true });
}
