import { hashOneTimeToken, newOneTimeToken } from '../../common/one-time-token.js';

export const INVITE_LIFETIME_MS = 72 * 3600 * 1000;

export const newInviteToken = newOneTimeToken;
export const hashInviteToken = hashOneTimeToken;
