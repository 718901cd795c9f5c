import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004657 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sweeps" ("id" serial primary key, "revision_id" int not null, "method" text check ("method" in ('superposed', 'jobs')) not null, "status" text check ("status" in ('queued', 'solving', 'solved', 'failed', 'cancelled')) not null default 'queued', "parameters" jsonb not null, "outputs" jsonb not null, "cells" int not null, "total" int not null, "message" text null, "created_at" timestamptz not null, "finished_at" timestamptz null, "author_id" int not null);`);
    this.addSql(`create index "sweeps_revision_id_created_at_index" on "sweeps" ("revision_id", "created_at");`);

    this.addSql(`create table "sweep_points" ("id" serial primary key, "sweep_id" int not null, "index" int not null, "values" jsonb not null, "status" text check ("status" in ('queued', 'solving', 'solved', 'failed', 'cancelled')) not null default 'queued', "result" jsonb null, "error" text null, "job_id" uuid null, "attempts" int not null default 0, "worker" varchar(200) null, "seconds" double precision null, "started_at" timestamptz null, "finished_at" timestamptz null, "run_id" int null);`);
    this.addSql(`alter table "sweep_points" add constraint "sweep_points_sweep_id_index_unique" unique ("sweep_id", "index");`);

    this.addSql(`alter table "sweeps" add constraint "sweeps_revision_id_foreign" foreign key ("revision_id") references "revisions" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "sweeps" add constraint "sweeps_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "sweep_points" add constraint "sweep_points_sweep_id_foreign" foreign key ("sweep_id") references "sweeps" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "sweep_points" add constraint "sweep_points_run_id_foreign" foreign key ("run_id") references "runs" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "sweep_points" drop constraint "sweep_points_sweep_id_foreign";`);

    this.addSql(`drop table if exists "sweeps" cascade;`);

    this.addSql(`drop table if exists "sweep_points" cascade;`);
  }

}
