import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import type { MikroORM } from '@mikro-orm/postgresql';
import { parseDesign } from '../../shared/design';
import { loadConfig } from '../../server/config';
import { openDatabase } from '../../server/db/orm';
import { seedDemo } from '../../server/seed/demo';
import { demoDesigns } from '../../server/seed/designs';
import { discretiseDesign } from '../../solver/grid';

/** The demo seed on a database of its own (it seeds only when there are no users at all). */
const dbName = `${process.env['PGDATABASE'] ?? 'osmolane_test'}_seed`;
let orm: MikroORM;

beforeAll(async () => {
  execFileSync('node', [join(__dirname, '..', '..', 'scripts', 'db.mjs'), 'ensure', dbName, '--fresh'], { stdio: 'ignore' });
  orm = await openDatabase({ dbName });
});

afterAll(async () => {
  await orm?.close(true);
});

const config = { ...loadConfig(), passwordHashCost: 4, demoPassword: 'seed-test-password' };

async function count(table: string): Promise<number> {
  const rows = await orm.em.fork().getConnection().execute<{ n: string }[]>(`select count(*) as n from ${table}`);
  return Number(rows[0]!.n);
}

describe('demo seed', () => {
  it('seeds Tidewater Assay Lab once: four people, four designs each with a first revision', async () => {
    expect(await seedDemo(orm, config)).toBe(true);
    expect(await seedDemo(orm, config)).toBe(false);
    expect(await count('users')).toBe(4);
    expect(await count('workspaces')).toBe(1);
    expect(await count('designs')).toBe(4);
    expect(await count('revisions')).toBe(4);
    const people = await orm.em
      .fork()
      .getConnection()
      .execute<{ email: string; role: string }[]>('select u.email, m.role from memberships m join users u on u.id = m.user_id order by u.id');
    expect(people).toEqual([
      { email: 'mira.okafor@example.test', role: 'owner' },
      { email: 'jonas.lindqvist@example.test', role: 'editor' },
      { email: 'priya.raman@example.test', role: 'reviewer' },
      { email: 'tom.beck@example.test', role: 'viewer' },
    ]);
  });

  it('seeds once when two servers start on one empty database at the same time', async () => {
    const name = `${dbName}_twice`;
    execFileSync('node', [join(__dirname, '..', '..', 'scripts', 'db.mjs'), 'ensure', name, '--fresh'], { stdio: 'ignore' });
    const [a, b] = await Promise.all([openDatabase({ dbName: name }), openDatabase({ dbName: name })]);
    try {
      const seeded = await Promise.all([seedDemo(a, config), seedDemo(b, config)]);
      expect(seeded.sort()).toEqual([false, true]);
      const rows = await a.em.fork().getConnection().execute<{ n: string }[]>('select count(*) as n from designs');
      expect(Number(rows[0]!.n)).toBe(4);
    } finally {
      await Promise.all([a.close(true), b.close(true)]);
    }
  });

  it.each(demoDesigns().map((d) => [d.name, d] as const))('%s is a valid design the solver can grid without problems', (_name, d) => {
    const parsed = parseDesign(d.document);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    expect(parsed.design.depth).toBe(2e-5);
    expect(parsed.design.zeta.side).toBe(-0.05);
    const grid = discretiseDesign(parsed.design);
    expect(grid.problems).toEqual([]);
    expect(grid.ok).toBe(true);
  });
});
