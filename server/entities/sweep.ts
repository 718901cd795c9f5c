import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { RUN_STATES, type SweepParameterInfo, type SweepOutput, type SweepPointResult } from '../../shared/api';
import { RevisionSchema, RunSchema } from './design';
import { UserSchema } from './user';

const p = defineEntity.properties;

/**
 * A sweep of a revision: one or two parameters of its (frozen) document over a range. Superposed sweeps are
 * solved when they are made; the others get one pg-boss job per point (server/jobs). The status moves
 * queued → solving → solved | failed, or to cancelled.
 */
export const SweepSchema = defineEntity({
  name: 'Sweep',
  tableName: 'sweeps',
  indexes: [{ properties: ['revision', 'createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    revision: p.manyToOne(RevisionSchema).deleteRule('cascade'),
    method: p.enum(['superposed', 'jobs']),
    status: p.enum([...RUN_STATES]).default('queued'),
    /** Each parameter with its label, dimension and every value it takes. */
    parameters: p.json<SweepParameterInfo[]>(),
    outputs: p.json<SweepOutput[]>(),
    cells: p.integer(),
    total: p.integer(),
    message: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    finishedAt: p.datetime().nullable(),
    author: p.manyToOne(UserSchema),
  },
});

export type Sweep = InferEntity<typeof SweepSchema>;

/**
 * One point of a sweep. Unique per (sweep, index), made with the sweep; a worker moves it to solving and then
 * solved or failed, and only from queued or solving, so a retried job never overwrites a stored result.
 */
export const SweepPointSchema = defineEntity({
  name: 'SweepPoint',
  tableName: 'sweep_points',
  uniques: [{ properties: ['sweep', 'index'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    sweep: p.manyToOne(SweepSchema).deleteRule('cascade'),
    index: p.integer(),
    values: p.json<number[]>(),
    status: p.enum([...RUN_STATES]).default('queued'),
    result: p.json<SweepPointResult>().nullable(),
    error: p.text().nullable(),
    /** The pg-boss job of the point (jobs method). */
    jobId: p.uuid().nullable(),
    attempts: p.integer().default(0),
    /** host:pid of the worker that last started it. */
    worker: p.string().length(200).nullable(),
    seconds: p.double().nullable(),
    startedAt: p.datetime().nullable(),
    finishedAt: p.datetime().nullable(),
    run: p.manyToOne(RunSchema).nullable().deleteRule('set null'),
  },
});

export type SweepPoint = InferEntity<typeof SweepPointSchema>;
