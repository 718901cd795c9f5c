import type { MikroORM } from '@mikro-orm/postgresql';
import type { Role } from '../../shared/api';
import type { ServerConfig } from '../config';
import { hashPassword } from '../auth/secrets';
import { queryRow, run } from '../db/sql';
import { checkDocument } from '../services/designs';
import { demoDesigns } from './designs';

const PEOPLE: { name: string; role: Role }[] = [
  { name: 'Mira Okafor', role: 'owner' },
  { name: 'Jonas Lindqvist', role: 'editor' },
  { name: 'Priya Raman', role: 'reviewer' },
  { name: 'Tom Beck', role: 'viewer' },
];

export const DEMO_WORKSPACE = 'Tidewater Assay Lab';

export function demoEmail(name: string): string {
  return `${name.toLowerCase().replace(/\s+/g, '.')}@example.test`;
}

/** Any fixed number: two servers starting on one empty database seed it once. */
const SEED_LOCK = 0x05_1a_5e;

/**
 * The demo workspace of product.md, written in one transaction when the database has no users yet (so running
 * it again, or on a database people already use, does nothing). Answers whether it seeded.
 */
export async function seedDemo(orm: MikroORM, config: ServerConfig): Promise<boolean> {
  const designs = demoDesigns();
  for (const d of designs) checkDocument(d.document);
  const passwordHash = await hashPassword(config.demoPassword, config.passwordHashCost);
  return orm.em.fork().transactional(async (em) => {
    await run(em, 'select pg_advisory_xact_lock(?)', [SEED_LOCK]);
    const users = await queryRow<{ n: string }>(em, 'select count(*) as n from users');
    if (Number(users?.n) > 0) return false;

    const ids = new Map<Role, number>();
    for (const person of PEOPLE) {
      const user = await queryRow<{ id: number }>(
        em,
        'insert into users (email, name, password_hash, created_at) values (?, ?, ?, now()) returning id',
        [demoEmail(person.name), person.name, passwordHash],
      );
      ids.set(person.role, user!.id);
    }
    const owner = ids.get('owner')!;
    const editor = ids.get('editor')!;
    const ws = await queryRow<{ id: number }>(em, 'insert into workspaces (name, created_at, created_by_id) values (?, now(), ?) returning id', [DEMO_WORKSPACE, owner]);
    const wid = ws!.id;
    for (const [role, userId] of ids) {
      await run(em, 'insert into memberships (workspace_id, user_id, role, created_at) values (?, ?, ?, now())', [wid, userId, role]);
    }
    const log = (actor: number, kind: string, message: string, designId: number | null = null) =>
      run(em, 'insert into activity_events (workspace_id, actor_id, design_id, kind, message, created_at) values (?, ?, ?, ?, ?, now())', [wid, actor, designId, kind, message]);
    await log(owner, 'workspace.created', `created the workspace "${DEMO_WORKSPACE}"`);
    for (const [role, userId] of ids) if (userId !== owner) await log(userId, 'member.joined', `joined as ${role}`);

    for (const d of designs) {
      const design = await queryRow<{ id: number }>(
        em,
        `insert into designs (workspace_id, name, document, version, review_state, created_at, created_by_id, updated_at, updated_by_id)
         values (?, ?, ?::json, 1, 'draft', now(), ?, now(), ?) returning id`,
        [wid, d.name, JSON.stringify(d.document), editor, editor],
      );
      const id = design!.id;
      await log(editor, 'design.created', `created the design "${d.name}"`, id);
      await run(
        em,
        `insert into revisions (design_id, number, note, document, created_at, author_id)
         select id, 1, ?, document, now(), ? from designs where id = ?`,
        [d.note, editor, id],
      );
      await log(editor, 'revision.created', `made revision 1 of "${d.name}" (version 1): ${d.note}`, id);
    }
    return true;
  });
}
