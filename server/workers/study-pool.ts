import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { StudyTask } from './study-task.js';

const ENTRY = path.join(path.dirname(fileURLToPath(import.meta.url)), 'study-worker.mjs');
/** The worker bundled at build time (`npm run build:worker`); `npm start` names it in STUDY_WORKER_BUNDLE. */
const BUNDLE = process.env.STUDY_WORKER_BUNDLE;

export interface StudyPool {
  readonly threads: number;
  /** Runs a task; `onProgress` gets 0…1 as the worker reports; `signal` cancels it. */
  run<R>(task: StudyTask, options?: { onProgress?: (p: number) => void; signal?: AbortSignal }): Promise<R>;
  close(): Promise<void>;
}

/**
 * Worker threads for studies, one per core by default, so the event loop stays free for requests.
 * With the build's bundled worker every thread starts with the server, loads the engine once and stays
 * (no cold start after idling); without it (tests, development) threads compile the TypeScript on demand.
 */
export function createStudyPool(threads = os.availableParallelism()): StudyPool {
  const warm = Boolean(BUNDLE);
  const piscina = new Piscina({
    filename: BUNDLE ? path.resolve(BUNDLE) : ENTRY, minThreads: warm ? threads : 0, maxThreads: threads, idleTimeout: warm ? Infinity : 30_000,
  });
  if (warm) for (let i = 0; i < threads; i++) void piscina.run({ kind: 'warm' } satisfies StudyTask).catch(() => undefined);
  return {
    threads,
    async run<R>(task: StudyTask, options: { onProgress?: (p: number) => void; signal?: AbortSignal } = {}) {
      if (task.kind === 'fault' || task.kind === 'warm' || !options.onProgress) return piscina.run(task, { signal: options.signal }) as Promise<R>;
      const { port1, port2 } = new MessageChannel();
      port1.on('message', (m: { progress: number }) => options.onProgress?.(m.progress));
      try {
        return (await piscina.run({ ...task, port: port2 }, { transferList: [port2], signal: options.signal })) as R;
      } finally {
        port1.close();
      }
    },
    close: () => piscina.close({ force: true }),
  };
}
