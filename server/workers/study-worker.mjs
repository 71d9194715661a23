// Worker entry: Node 20 cannot start a .ts worker directly, so register tsx first, then load the task.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.server.json', import.meta.url)) });
const task = await import('./study.worker.ts');
export default task.default;
