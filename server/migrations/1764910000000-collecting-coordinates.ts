import type { MigrationInterface, QueryRunner } from "typeorm";

/** The accession's own collecting coordinates and elevation (MCPD DECLATITUDE, DECLONGITUDE, ELEVATION), optional (issue 14). */

export class CollectingCoordinates1764910000000 implements MigrationInterface {
    name = 'CollectingCoordinates1764910000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "accession" ADD COLUMN "collectingLatitude" real`);
        await queryRunner.query(`ALTER TABLE "accession" ADD COLUMN "collectingLongitude" real`);
        await queryRunner.query(`ALTER TABLE "accession" ADD COLUMN "collectingElevationM" real`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "accession" DROP COLUMN "collectingElevationM"`);
        await queryRunner.query(`ALTER TABLE "accession" DROP COLUMN "collectingLongitude"`);
        await queryRunner.query(`ALTER TABLE "accession" DROP COLUMN "collectingLatitude"`);
    }

}
