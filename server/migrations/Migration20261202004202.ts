import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004202 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "design_files" ("id" serial primary key, "design_id" int not null, "kind" varchar(32) not null, "key" varchar(200) not null, "file_name" varchar(255) not null, "content_type" varchar(100) not null, "size" int not null, "sha256" varchar(64) not null, "created_at" timestamptz not null, "created_by_id" int null);`);
    this.addSql(`alter table "design_files" add constraint "design_files_key_unique" unique ("key");`);
    this.addSql(`create index "design_files_design_id_created_at_index" on "design_files" ("design_id", "created_at");`);

    this.addSql(`alter table "design_files" add constraint "design_files_design_id_foreign" foreign key ("design_id") references "designs" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "design_files" add constraint "design_files_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "design_files" cascade;`);
  }

}
