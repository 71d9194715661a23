import type { Request } from 'express';
import type { AppConfig } from '../config.js';

/** The base of links sent in e-mails: PUBLIC_URL when set, else the address this request came to. */
export const publicBaseUrl = (config: AppConfig, req: Pick<Request, 'protocol' | 'get'>): string =>
  config.publicUrl ?? `${req.protocol}://${req.get('host')}`;
