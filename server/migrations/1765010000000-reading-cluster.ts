import { MigrationInterface, QueryRunner } from 'typeorm';

/** A photo reading may be of one colour of a region that held several (ground, stripe): which one, how many, its share and spread. */
export class ReadingCluster1765010000000 implements MigrationInterface {
  name = 'ReadingCluster1765010000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    // A nullable column added in place: SQLite keeps every row, index and key of the table.
    await queryRunner.query(`ALTER TABLE "reading" ADD COLUMN "cluster" text`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "reading" DROP COLUMN "cluster"`);
  }
}
