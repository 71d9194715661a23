import type { DataSource } from 'typeorm';
import { containsText } from '../../common/search.js';
import { channelSchema } from '../../../shared/schemas/chain.js';
import type { DesignCreateBody, DesignPatchBody } from '../../../shared/schemas/designs.js';
import { recordAudit } from '../../common/audit.js';
import { NotFoundError } from '../../common/errors.js';
import { Channel } from '../../entities/Channel.js';
import { Design } from '../../entities/Design.js';
import { Revision } from '../../entities/Revision.js';
import type { User } from '../../entities/User.js';
import { TEMPLATE_CHANNELS } from './design-template.js';
import { compareLetters } from './revision-letters.js';
import type { DesignSort } from '../../../shared/schemas/designs.js';

export interface DesignListOptions {
  page: number;
  pageSize: number;
  search?: string;
  sort: DesignSort;
  order: 'asc' | 'desc';
}

/** A list row: the design with its owner and its newest revision. */
export async function listDesigns(dataSource: DataSource, o: DesignListOptions) {
  const [designs, total] = await dataSource.getRepository(Design).findAndCount({
    where: o.search ? { name: containsText(o.search) } : undefined,
    relations: { owner: true, revisions: true },
    // The owner column sorts by the name people see.
    order: { ...(o.sort === 'owner' ? { owner: { displayName: o.order } } : { [o.sort]: o.order }), id: 'ASC' },
    skip: (o.page - 1) * o.pageSize,
    take: o.pageSize,
  });
  return { designs, total };
}

export async function getDesign(dataSource: DataSource, id: number): Promise<Design> {
  const design = await dataSource.getRepository(Design).findOne({ where: { id }, relations: { owner: true, revisions: { createdBy: true } } });
  if (!design) throw new NotFoundError(`no design with id ${id}`);
  design.revisions.sort((a, b) => compareLetters(a.letter, b.letter));
  return design;
}

/** A new design starts with revision A, a draft with the template channels (pack side and link side). */
export async function createDesign(dataSource: DataSource, actor: User, body: DesignCreateBody): Promise<Design> {
  const id = await dataSource.transaction(async (m) => {
    const design = await m.getRepository(Design).save(m.getRepository(Design).create({ ...body, ownerId: actor.id }));
    const revision = await m.getRepository(Revision).save(
      m.getRepository(Revision).create({ designId: design.id, letter: 'A', state: 'draft', createdById: actor.id, note: '' }),
    );
    const channels = m.getRepository(Channel);
    await channels.save(TEMPLATE_CHANNELS.map((c, position) =>
      channels.create({ revisionId: revision.id, key: c.key, position, definition: channelSchema.parse(c.definition) })));
    await recordAudit(m, actor.id, 'design.create', `design:${design.id}`, { name: design.name });
    return design.id;
  });
  return getDesign(dataSource, id);
}

export async function updateDesign(dataSource: DataSource, actor: User, id: number, patch: DesignPatchBody): Promise<Design> {
  await dataSource.transaction(async (m) => {
    const repo = m.getRepository(Design);
    const design = await repo.findOneBy({ id });
    if (!design) throw new NotFoundError(`no design with id ${id}`);
    Object.assign(design, patch);
    await repo.save(design);
    await recordAudit(m, actor.id, 'design.update', `design:${id}`, patch as Record<string, unknown>);
  });
  return getDesign(dataSource, id);
}
