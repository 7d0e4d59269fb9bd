import { MigrationInterface, QueryRunner } from 'typeorm';

/** A table's own CREATE statement and its indexes' statements, as SQLite keeps them. */
async function definition(queryRunner: QueryRunner, table: string): Promise<{ create: string; indexes: string[] }> {
  const rows = (await queryRunner.query(`SELECT "type", "sql" FROM "sqlite_master" WHERE "tbl_name" = ? AND "sql" IS NOT NULL`, [table])) as { type: string; sql: string }[];
  const create = rows.find((r) => r.type === 'table')?.sql;
  if (!create) throw new Error(`no table ${table}`);
  return { create, indexes: rows.filter((r) => r.type === 'index').map((r) => r.sql) };
}

/**
 * Rebuilds `reading` from its own stored definition with one column's NOT NULL changed (SQLite
 * cannot alter a column in place), keeping every other column, key and index as they are now —
 * whichever later migrations have already run on this database. TypeORM's better-sqlite3 runner
 * turns foreign keys off around migrations, so the readings that reviews and audits point at
 * keep their ids; the key check at the end proves nothing dangles.
 */
async function rebuildReading(queryRunner: QueryRunner, from: string, to: string): Promise<void> {
  const { create, indexes } = await definition(queryRunner, 'reading');
  if (!create.includes(from)) throw new Error(`reading: expected ${from} in its definition`);
  const columns = ((await queryRunner.query(`PRAGMA table_info("reading")`)) as { name: string }[]).map((c) => `"${c.name}"`).join(', ');
  await queryRunner.query(create.replace(from, to).replace(/^CREATE TABLE "reading"/, 'CREATE TABLE "temporary_reading"'));
  await queryRunner.query(`INSERT INTO "temporary_reading"(${columns}) SELECT ${columns} FROM "reading"`);
  await queryRunner.query(`DROP TABLE "reading"`);
  await queryRunner.query(`ALTER TABLE "temporary_reading" RENAME TO "reading"`);
  for (const index of indexes) await queryRunner.query(index);
  const dangling = (await queryRunner.query(`PRAGMA foreign_key_check`)) as unknown[];
  if (dangling.length) throw new Error(`reading rebuild left ${dangling.length} foreign keys dangling`);
}

/**
 * An instrument reading carries no ambient light (the instrument lights the sample): `light`
 * becomes nullable; the illuminant/observer the instrument reported and, when adapted to D65/2°,
 * the L*a*b* as reported are kept.
 */
export class InstrumentIlluminant1765000000000 implements MigrationInterface {
  name = 'InstrumentIlluminant1765000000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "reading" ADD COLUMN "illuminant" varchar(8)`);
    await queryRunner.query(`ALTER TABLE "reading" ADD COLUMN "reportedLab" text`);
    await rebuildReading(queryRunner, '"light" varchar(20) NOT NULL', '"light" varchar(20)');
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    // Instrument readings saved without a light cannot go back under NOT NULL: named as such.
    await queryRunner.query(`UPDATE "reading" SET "light" = 'viewing-booth' WHERE "light" IS NULL`);
    await rebuildReading(queryRunner, '"light" varchar(20)', '"light" varchar(20) NOT NULL');
    await queryRunner.query(`ALTER TABLE "reading" DROP COLUMN "reportedLab"`);
    await queryRunner.query(`ALTER TABLE "reading" DROP COLUMN "illuminant"`);
  }
}
