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
        // A database written before the API refused such pairs may hold some: name them, rather than
        // stopping on SQLite's bare "UNIQUE constraint failed", so an admin knows which to rename.
        const clashes: string[] = [];
        for (const [table, column, what] of [['accession', 'accessionNumber', 'accession numbers'], ['site', 'code', 'site codes']] as const) {
            const rows: { ids: string; values: string }[] = await queryRunner.query(
                `SELECT GROUP_CONCAT("id", ', ') AS ids, GROUP_CONCAT("${column}", ', ') AS "values" FROM "${table}" GROUP BY LOWER("${column}") HAVING COUNT(*) > 1`,
            );
            for (const row of rows) clashes.push(`${what} ${row.values} (ids ${row.ids}) differ only in letter case`);
        }
        if (clashes.length) {
            throw new Error(`Cannot make accession numbers and site codes unique regardless of case: ${clashes.join('; ')}. Rename all but one of each, then start again.`);
        }
        await queryRunner.query(`CREATE UNIQUE INDEX "IDX_accession_number_lower" ON "accession" (LOWER("accessionNumber"))`);
        await queryRunner.query(`CREATE UNIQUE INDEX "IDX_site_code_lower" ON "site" (LOWER("code"))`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_site_code_lower"`);
        await queryRunner.query(`DROP INDEX "IDX_accession_number_lower"`);
    }

}
