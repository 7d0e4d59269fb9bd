import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Accession numbers and site codes unique regardless of letter case, in the database itself (issue 14):
 * the API already refuses "hl-0001" beside "HL-0001", and these indexes refuse it from any other writer
 * too (imports, scripts, a repository save). Unique expression indexes on LOWER(...) rather than
 * COLLATE NOCASE on the columns, so ordering and equality elsewhere keep comparing exactly as before;
 * SQLite's LOWER folds ASCII letters only, the same folding the API's check uses. The entities declare
 * them with `synchronize: false`, since TypeORM cannot describe an expression index.
 */
export class CaseInsensitiveCodes1765030000000 implements MigrationInterface {
    name = 'CaseInsensitiveCodes1765030000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE UNIQUE INDEX "IDX_accession_number_lower" ON "accession" (LOWER("accessionNumber"))`);
        await queryRunner.query(`CREATE UNIQUE INDEX "IDX_site_code_lower" ON "site" (LOWER("code"))`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_site_code_lower"`);
        await queryRunner.query(`DROP INDEX "IDX_accession_number_lower"`);
    }

}
