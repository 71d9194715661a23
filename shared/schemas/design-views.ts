import type { ChannelDefinition } from './chain.js';
import type { RevisionState } from './designs.js';

/** What the server returns about designs and revisions; one definition for the server and the client. */

export interface PersonRef {
  id: number;
  displayName: string;
}

export interface RevisionRef {
  id: number;
  letter: string;
  state: RevisionState;
}

export interface DesignRow {
  id: number;
  name: string;
  purpose: string;
  owner: PersonRef;
  latestRevision: RevisionRef | null;
  createdAt: string;
  updatedAt: string;
}

export interface DesignList {
  items: DesignRow[];
  total: number;
}

export interface RevisionSummary extends RevisionRef {
  note: string;
  basedOnId: number | null;
  createdBy?: PersonRef;
  createdAt: string;
  updatedAt: string;
}

export interface DesignDetail extends DesignRow {
  revisions: RevisionSummary[];
}

export interface RevisionChannel {
  id: number;
  key: string;
  position: number;
  definition: ChannelDefinition;
}

export interface RevisionDetail extends RevisionSummary {
  design: { id: number; name: string; owner: PersonRef };
  channels: RevisionChannel[];
  /** Goes up by one with every saved change of the channels; a save names the version it was based on. */
  version: number;
  /** Who saved the channels last (null before the first save after creation). */
  updatedBy: PersonRef | null;
}

/** One audit entry about a revision, newest first in the history list. */
export interface HistoryEvent {
  id: number;
  actorId: number | null;
  action: string;
  subject: string;
  detail: unknown;
  at: string;
}
