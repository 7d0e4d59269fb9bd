import type { MigrationInterface, QueryRunner } from 'typeorm';
import { WALK_ORDER, UNLISTED_FROM } from '../collection/walk-order.js';

/**
 * The plant sheet (issue 13): skipped characters per plant and season, a descriptor's link to the
 * colour character of the same part, each person's units on the server, and both catalogues
 * renumbered into one walk of the plant (seeded codes by walk-order.ts, others after them).
 */
export class PlantSheet1764900000000 implements MigrationInterface {
  name = 'PlantSheet1764900000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "plant_skip" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "plantId" integer NOT NULL, "characterId" integer, "descriptorId" integer, "season" varchar(40), "seasonYear" integer NOT NULL, "reason" varchar(300) NOT NULL, "userId" integer NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')))`,
    );
    await queryRunner.query(`CREATE INDEX "IDX_a8fc4461c6b290211b31ead531" ON "plant_skip" ("plantId", "seasonYear") `);
    await queryRunner.query(`ALTER TABLE "descriptor" ADD COLUMN "characterId" integer`);
    await queryRunner.query(`ALTER TABLE "user" ADD COLUMN "unitSystem" varchar(8) NOT NULL DEFAULT ('metric')`);
    for (const table of ['character', 'descriptor']) {
      const rows = (await queryRunner.query(`SELECT "id", "code", "sortOrder" FROM "${table}"`)) as { id: number; code: string; sortOrder: number }[];
      for (const row of rows) {
        await queryRunner.query(`UPDATE "${table}" SET "sortOrder" = ? WHERE "id" = ?`, [WALK_ORDER[row.code] ?? UNLISTED_FROM + row.sortOrder, row.id]);
      }
    }
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "user" DROP COLUMN "unitSystem"`);
    await queryRunner.query(`ALTER TABLE "descriptor" DROP COLUMN "characterId"`);
    await queryRunner.query(`DROP INDEX "IDX_a8fc4461c6b290211b31ead531"`);
    await queryRunner.query(`DROP TABLE "plant_skip"`);
  }
}
