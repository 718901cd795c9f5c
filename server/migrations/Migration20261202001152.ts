import { Migration } from '@mikro-orm/migrations';

export class Migration20261202001152 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "run_blobs" ("key" varchar(200) not null, "bytes" bytea not null, "size" int not null, "created_at" timestamptz not null, constraint "run_blobs_pkey" primary key ("key"));`);
    // Field blobs arrive compressed: store them out of line without trying to compress them again (by hand).
    this.addSql(`alter table "run_blobs" alter column "bytes" set storage external;`);

    this.addSql(`create table "sessions" ("id" uuid not null, "user_id" int not null, "refresh_hash" varchar(64) not null, "previous_hash" varchar(64) null, "rotated_at" timestamptz not null, "created_at" timestamptz not null, "expires_at" timestamptz not null, constraint "sessions_pkey" primary key ("id"));`);
    this.addSql(`create index "sessions_user_id_index" on "sessions" ("user_id");`);

    this.addSql(`create table "password_resets" ("id" serial primary key, "user_id" int not null, "token_hash" varchar(64) not null, "created_at" timestamptz not null, "expires_at" timestamptz not null, "used_at" timestamptz null);`);
    this.addSql(`alter table "password_resets" add constraint "password_resets_token_hash_unique" unique ("token_hash");`);
    this.addSql(`create index "password_resets_user_id_index" on "password_resets" ("user_id");`);

    this.addSql(`create table "workspaces" ("id" serial primary key, "name" varchar(200) not null, "created_at" timestamptz not null, "created_by_id" int null);`);

    this.addSql(`create table "memberships" ("id" serial primary key, "workspace_id" int not null, "user_id" int not null, "role" text check ("role" in ('owner', 'editor', 'reviewer', 'viewer')) not null, "created_at" timestamptz not null);`);
    this.addSql(`create index "memberships_user_id_index" on "memberships" ("user_id");`);
    this.addSql(`alter table "memberships" add constraint "memberships_workspace_id_user_id_unique" unique ("workspace_id", "user_id");`);

    this.addSql(`create table "library_items" ("id" serial primary key, "workspace_id" int null, "built_in_key" varchar(64) null, "kind" text check ("kind" in ('buffer', 'wall')) not null, "name" varchar(200) not null, "values" jsonb not null, "source" text not null default '', "created_at" timestamptz not null, "updated_at" timestamptz not null, "created_by_id" int null);`);
    this.addSql(`alter table "library_items" add constraint "library_items_built_in_key_unique" unique ("built_in_key");`);
    this.addSql(`create index "library_items_workspace_id_index" on "library_items" ("workspace_id");`);

    this.addSql(`create table "invitations" ("id" serial primary key, "workspace_id" int not null, "email" varchar(320) not null, "role" text check ("role" in ('owner', 'editor', 'reviewer', 'viewer')) not null, "token_hash" varchar(64) not null, "invited_by_id" int null, "created_at" timestamptz not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "accepted_by_id" int null);`);
    this.addSql(`alter table "invitations" add constraint "invitations_token_hash_unique" unique ("token_hash");`);
    this.addSql(`create index "invitations_workspace_id_email_index" on "invitations" ("workspace_id", "email");`);

    this.addSql(`create table "designs" ("id" serial primary key, "workspace_id" int not null, "name" varchar(200) not null, "document" json not null, "version" int not null default 1, "review_state" text check ("review_state" in ('draft', 'in review', 'mask-ready')) not null default 'draft', "created_at" timestamptz not null, "created_by_id" int null, "updated_at" timestamptz not null, "updated_by_id" int null);`);
    this.addSql(`create index "designs_workspace_id_updated_at_index" on "designs" ("workspace_id", "updated_at");`);

    this.addSql(`create table "revisions" ("id" serial primary key, "design_id" int not null, "number" int not null, "note" text not null default '', "document" json not null, "created_at" timestamptz not null, "author_id" int not null);`);
    this.addSql(`alter table "revisions" add constraint "revisions_design_id_number_unique" unique ("design_id", "number");`);

    this.addSql(`create table "runs" ("id" serial primary key, "revision_id" int not null, "status" text check ("status" in ('queued', 'solving', 'solved', 'failed', 'cancelled')) not null default 'solved', "settings" jsonb not null, "summary" jsonb not null, "blob_key" varchar(200) null, "blob_bytes" int null, "created_at" timestamptz not null, "author_id" int not null);`);
    this.addSql(`create index "runs_revision_id_created_at_index" on "runs" ("revision_id", "created_at");`);

    this.addSql(`create table "comments" ("id" serial primary key, "revision_id" int not null, "author_id" int not null, "body" text not null, "at" jsonb null, "created_at" timestamptz not null);`);
    this.addSql(`create index "comments_revision_id_created_at_index" on "comments" ("revision_id", "created_at");`);

    this.addSql(`create table "activity_events" ("id" serial primary key, "workspace_id" int not null, "actor_id" int null, "design_id" int null, "kind" varchar(64) not null, "message" text not null, "created_at" timestamptz not null);`);
    this.addSql(`create index "activity_events_workspace_id_created_at_index" on "activity_events" ("workspace_id", "created_at");`);
    this.addSql(`create index "activity_events_design_id_created_at_index" on "activity_events" ("design_id", "created_at");`);

    this.addSql(`alter table "sessions" add constraint "sessions_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "password_resets" add constraint "password_resets_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "workspaces" add constraint "workspaces_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "memberships" add constraint "memberships_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "library_items" add constraint "library_items_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "library_items" add constraint "library_items_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "invitations" add constraint "invitations_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitations" add constraint "invitations_invited_by_id_foreign" foreign key ("invited_by_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "invitations" add constraint "invitations_accepted_by_id_foreign" foreign key ("accepted_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "designs" add constraint "designs_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "designs" add constraint "designs_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "designs" add constraint "designs_updated_by_id_foreign" foreign key ("updated_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "revisions" add constraint "revisions_design_id_foreign" foreign key ("design_id") references "designs" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "revisions" add constraint "revisions_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "runs" add constraint "runs_revision_id_foreign" foreign key ("revision_id") references "revisions" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "runs" add constraint "runs_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "comments" add constraint "comments_revision_id_foreign" foreign key ("revision_id") references "revisions" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "comments" add constraint "comments_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "activity_events" add constraint "activity_events_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "activity_events" add constraint "activity_events_actor_id_foreign" foreign key ("actor_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "activity_events" add constraint "activity_events_design_id_foreign" foreign key ("design_id") references "designs" ("id") on update cascade on delete set null;`);

    // Revisions are frozen copies: the database itself refuses to change one, whoever asks (written by hand).
    this.addSql(`create function "refuse_revision_update"() returns trigger language plpgsql as $$
      begin
        raise exception 'revision % is frozen: revisions cannot be changed once made', old.id using errcode = 'integrity_constraint_violation';
      end $$;`);
    this.addSql(`create trigger "revisions_frozen" before update on "revisions" for each row execute function "refuse_revision_update"();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists "revisions_frozen" on "revisions";`);
    this.addSql(`drop function if exists "refuse_revision_update"();`);

    this.addSql(`alter table "memberships" drop constraint "memberships_workspace_id_foreign";`);

    this.addSql(`alter table "library_items" drop constraint "library_items_workspace_id_foreign";`);

    this.addSql(`alter table "invitations" drop constraint "invitations_workspace_id_foreign";`);

    this.addSql(`alter table "designs" drop constraint "designs_workspace_id_foreign";`);

    this.addSql(`alter table "activity_events" drop constraint "activity_events_workspace_id_foreign";`);

    this.addSql(`alter table "revisions" drop constraint "revisions_design_id_foreign";`);

    this.addSql(`alter table "activity_events" drop constraint "activity_events_design_id_foreign";`);

    this.addSql(`alter table "runs" drop constraint "runs_revision_id_foreign";`);

    this.addSql(`alter table "comments" drop constraint "comments_revision_id_foreign";`);

    this.addSql(`drop table if exists "run_blobs" cascade;`);

    this.addSql(`drop table if exists "sessions" cascade;`);

    this.addSql(`drop table if exists "password_resets" cascade;`);

    this.addSql(`drop table if exists "workspaces" cascade;`);

    this.addSql(`drop table if exists "memberships" cascade;`);

    this.addSql(`drop table if exists "library_items" cascade;`);

    this.addSql(`drop table if exists "invitations" cascade;`);

    this.addSql(`drop table if exists "designs" cascade;`);

    this.addSql(`drop table if exists "revisions" cascade;`);

    this.addSql(`drop table if exists "runs" cascade;`);

    this.addSql(`drop table if exists "comments" cascade;`);

    this.addSql(`drop table if exists "activity_events" cascade;`);
  }

}
