// Piscina entry: Node 20 cannot load a .ts worker directly, so register tsx first.
import { register } from 'tsx/esm/api';

register({ tsconfig: new URL('../../tsconfig.server.json', import.meta.url).pathname });
const tasks = await import('./bench-worker.ts');

export const channelChunk = tasks.channelChunk;
export const prechargeChunk = tasks.prechargeChunk;
export default tasks.channelChunk;
