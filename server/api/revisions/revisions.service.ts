import type { DataSource, EntityManager } from 'typeorm';
import type { RevisionChannelsBody } from '../../../shared/schemas/designs.js';
import { REVISION_STATE_LABELS } from '../../../shared/schemas/designs.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, NotFoundError } from '../../common/errors.js';
import { assertCurrentVersion } from '../../common/save-version.js';
import { AuditEvent } from '../../entities/AuditEvent.js';
import { Channel } from '../../entities/Channel.js';
import { Design } from '../../entities/Design.js';
import { Revision } from '../../entities/Revision.js';
import type { User } from '../../entities/User.js';
import { compareLetters, nextRevisionLetter } from '../designs/revision-letters.js';
import { copyMarginInputs } from '../margin/margin.service.js';

export async function getRevision(dataSource: DataSource | EntityManager, id: number): Promise<Revision> {
  const revision = await dataSource.getRepository(Revision).findOne({
    where: { id },
    relations: { design: { owner: true }, channels: true, createdBy: true, updatedBy: true },
  });
  if (!revision) throw new NotFoundError(`no revision with id ${id}`);
  revision.channels.sort((a, b) => a.position - b.position);
  return revision;
}

export const revisionHistory = (dataSource: DataSource, id: number) =>
  dataSource.getRepository(AuditEvent).find({ where: { subject: `revision:${id}` }, order: { at: 'ASC', id: 'ASC' } });

/** Only a draft may change; anything else says how to go on. */
export function assertDraft(revision: Revision): void {
  if (revision.state !== 'draft') {
    throw new ConflictError(
      `revision ${revision.letter} is ${REVISION_STATE_LABELS[revision.state].toLowerCase()} and cannot be edited; start the next revision from it`,
    );
  }
}

/**
 * Writes a revision's channels keeping each channel's id: a key still present is updated in place, a new
 * key inserted, a dropped key deleted. Ids appear in API answers and run snapshots, so they must not churn.
 */
async function writeChannels(m: EntityManager, revisionId: number, existing: Channel[], wanted: RevisionChannelsBody['channels']): Promise<void> {
  const repo = m.getRepository(Channel);
  const byKey = new Map(existing.map((c) => [c.key, c]));
  const kept = new Set(wanted.map((c) => c.key));
  const dropped = existing.filter((c) => !kept.has(c.key)).map((c) => c.id);
  if (dropped.length > 0) await repo.delete(dropped);
  for (const [position, c] of wanted.entries()) {
    const old = byKey.get(c.key);
    if (old) await repo.update({ id: old.id }, { position, definition: c.definition });
    else await repo.insert({ revisionId, key: c.key, position, definition: c.definition });
  }
}

/** A channels save; `baseVersion` is left out only by trusted callers (the demo seed), never by the API. */
export type ChannelsSave = Omit<RevisionChannelsBody, 'baseVersion'> & { baseVersion?: number };

/** Replaces the channels of a draft revision in one transaction, refusing a save based on an older version. */
export async function replaceChannels(dataSource: DataSource, actor: User, id: number, body: ChannelsSave): Promise<Revision> {
  await dataSource.transaction(async (m) => {
    const revision = await getRevision(m, id);
    assertDraft(revision);
    assertCurrentVersion('channels', body.baseVersion, { version: revision.version, savedBy: revision.updatedBy, savedAt: revision.updatedAt });
    if (body.note !== undefined) revision.note = body.note;
    revision.updatedAt = new Date();
    // Compare-and-set on the version read above, so two saves can never both build on it.
    const bumped = await m.getRepository(Revision).update(
      { id, version: revision.version },
      { note: revision.note, updatedAt: revision.updatedAt, updatedById: actor.id, version: revision.version + 1 },
    );
    if (!bumped.affected) throw new ConflictError(`revision ${revision.letter} changed while saving; reload it and save again`);
    await writeChannels(m, id, revision.channels, body.channels);
    await m.getRepository(Design).update({ id: revision.designId }, { updatedAt: new Date() });
    await recordAudit(m, actor.id, 'revision.edit', `revision:${id}`, { channels: body.channels.map((c) => c.key) });
  });
  return getRevision(dataSource, id);
}

/** Starts the next lettered draft from an existing revision, copying its channels. One draft at a time. */
export async function startNextRevision(dataSource: DataSource, actor: User, designId: number, fromRevisionId: number): Promise<Revision> {
  const id = await dataSource.transaction(async (m) => {
    const revisions = await m.getRepository(Revision).find({ where: { designId } });
    if (revisions.length === 0) throw new NotFoundError(`no design with id ${designId}`);
    const from = revisions.find((r) => r.id === fromRevisionId);
    if (!from) throw new NotFoundError(`revision ${fromRevisionId} is not part of design ${designId}`, );
    const draft = revisions.find((r) => r.state === 'draft');
    if (draft) throw new ConflictError(`revision ${draft.letter} is already a draft; edit it instead of starting another`);
    const last = revisions.map((r) => r.letter).sort(compareLetters).at(-1) ?? null;
    const source = await getRevision(m, from.id);
    const created = await m.getRepository(Revision).save(m.getRepository(Revision).create({
      designId, letter: nextRevisionLetter(last), state: 'draft', basedOnId: from.id, createdById: actor.id, note: '',
    }));
    const channels = m.getRepository(Channel);
    await channels.save(source.channels.map((c) => channels.create({ revisionId: created.id, key: c.key, position: c.position, definition: c.definition })));
    await copyMarginInputs(m, from.id, created.id);
    await m.getRepository(Design).update({ id: designId }, { updatedAt: new Date() });
    await recordAudit(m, actor.id, 'revision.start', `revision:${created.id}`, { from: from.letter });
    return created.id;
  });
  return getRevision(dataSource, id);
}
