import type { Request } from 'express';
import type { AppConfig } from '../config.js';
import { HttpError } from './errors.js';

/**
 * The base of links sent in e-mails. Never the request's Host or X-Forwarded-Host header, which any
 * client can set to send colleagues a link to another site. PUBLIC_URL when set; otherwise the address
 * and port this server accepted the connection on (with HOST=0.0.0.0, the interface the request came in
 * by, which the sender could reach). Behind a proxy that address is the proxy's, so PUBLIC_URL is required.
 * @throws HttpError 503 behind a proxy without PUBLIC_URL, before anything is stored or sent
 */
export function publicBaseUrl(config: AppConfig, req: Pick<Request, 'socket'>): string {
  if (config.publicUrl) return config.publicUrl;
  const { localAddress, localPort } = req.socket;
  if (config.trustProxy || !localAddress || !localPort) {
    throw new HttpError(503, 'this e-mail carries a link, and behind a proxy (TRUST_PROXY) the server cannot tell the address people reach it by: the admin must set PUBLIC_URL. Nothing was sent or changed');
  }
  const address = localAddress.replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/, '');
  return `http://${address.includes(':') ? `[${address}]` : address}:${localPort}`;
}

/**
 * PUBLIC_URL as configured, checked: an absolute http(s) URL, kept without its trailing slash.
 * @throws Error naming PUBLIC_URL when it is not one
 */
export function readPublicUrl(value: string | undefined): string | null {
  if (!value) return null;
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new Error(`PUBLIC_URL must be an absolute http(s) address such as https://tallyvolt.example.test, got ${value}`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new Error(`PUBLIC_URL must start with http:// or https://, got ${value}`);
  }
  return `${url.origin}${url.pathname}`.replace(/\/+$/, '');
}
