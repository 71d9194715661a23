import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { StudyTask } from './study-task.js';

const ENTRY = path.join(path.dirname(fileURLToPath(import.meta.url)), 'study-worker.mjs');

export interface StudyPool {
  readonly threads: number;
  /** Runs a task; `onProgress` gets 0…1 as the worker reports; `signal` cancels it. */
  run<R>(task: StudyTask, options?: { onProgress?: (p: number) => void; signal?: AbortSignal }): Promise<R>;
  close(): Promise<void>;
}

/** Worker threads for studies, one per core by default, so the event loop stays free for requests. */
export function createStudyPool(threads = os.availableParallelism()): StudyPool {
  const piscina = new Piscina({ filename: ENTRY, minThreads: 0, maxThreads: threads, idleTimeout: 30_000 });
  return {
    threads,
    async run<R>(task: StudyTask, options: { onProgress?: (p: number) => void; signal?: AbortSignal } = {}) {
      if (task.kind === 'fault' || !options.onProgress) return piscina.run(task, { signal: options.signal }) as Promise<R>;
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
