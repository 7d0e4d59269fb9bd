import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { AuditEvent } from './audit/audit-event.entity.js';
import { ApiToken } from './brapi/api-token.entity.js';
import { Invitation } from './auth/invitation.entity.js';
import { PasswordReset } from './auth/password-reset.entity.js';
import { SessionRecord } from './auth/session.entity.js';
import { User } from './auth/user.entity.js';
import { CalibrationResponse, CalibrationSession, Participant, Specimen } from './calibration/calibration-session.entity.js';
import { Certification, ColourVisionScreening } from './calibration/certification.entity.js';
import { Accession, Plant } from './collection/accession.entity.js';
import { Character } from './collection/character.entity.js';
import { Descriptor } from './collection/descriptor.entity.js';
import { Observation } from './collection/observation.entity.js';
import { PlantSkip } from './collection/plant-skip.entity.js';
import { Season, Site } from './collection/site.entity.js';
import { MailMessage } from './mail/mail-message.entity.js';
import { Photo } from './photos/photo.entity.js';
import { IdempotencyKey } from './idempotency/idempotency-key.entity.js';
import { Initial1764633600000 } from './migrations/1764633600000-initial.js';
import { ReferenceSets1764720000000 } from './migrations/1764720000000-reference-sets.js';
import { Photos1764730000000 } from './migrations/1764730000000-photos.js';
import { Readings1764800000000 } from './migrations/1764800000000-readings.js';
import { CollectionManagement1764810000000 } from './migrations/1764810000000-collection-management.js';
import { Calibration1764820000000 } from './migrations/1764820000000-calibration.js';
import { Idempotency1764830000000 } from './migrations/1764830000000-idempotency.js';
import { Reviews1764840000000 } from './migrations/1764840000000-reviews.js';
import { PlantSheet1764900000000 } from './migrations/1764900000000-plant-sheet.js';
import { CollectingCoordinates1764910000000 } from './migrations/1764910000000-collecting-coordinates.js';
import { ReferenceSetChoice1764920000000 } from './migrations/1764920000000-reference-set-choice.js';
import { CalibrationNotices1764930000000 } from './migrations/1764930000000-calibration-notices.js';
import { ApiTokens1764940000000 } from './migrations/1764940000000-api-tokens.js';
import { InstrumentIlluminant1765000000000 } from './migrations/1765000000000-instrument-illuminant.js';
import { ReadingCluster1765010000000 } from './migrations/1765010000000-reading-cluster.js';
import { PrintBatches1765010001000 } from './migrations/1765010001000-print-batches.js';
import { CaseInsensitiveCodes1765030000000 } from './migrations/1765030000000-case-insensitive-codes.js';
import { Reading } from './readings/reading.entity.js';
import { Notification, Review } from './reviews/review.entity.js';
import { Chip, ReferenceSet, ReferenceSetChoice } from './reference-sets/reference-set.entity.js';
import { PrintBatch, PrintPatch } from './reference-sets/print-batch.entity.js';

/** Every entity, listed explicitly (no globs: the same list works under tsx, tsc and the CLI). */
export const ENTITIES = [User, Invitation, PasswordReset, SessionRecord, AuditEvent, MailMessage, Site, Season, Accession, Plant, Character, ReferenceSet, Chip, ReferenceSetChoice, Photo, Descriptor, Observation, CalibrationSession, Specimen, Participant, CalibrationResponse, Certification, ColourVisionScreening, IdempotencyKey, Reading, Review, Notification, ApiToken, PlantSkip, PrintBatch, PrintPatch];

/** Every migration in order; they run at start-up. */
export const MIGRATIONS = [Initial1764633600000, ReferenceSets1764720000000, Photos1764730000000, Readings1764800000000, CollectionManagement1764810000000, Calibration1764820000000, Idempotency1764830000000, Reviews1764840000000, PlantSheet1764900000000, CollectingCoordinates1764910000000, ReferenceSetChoice1764920000000, CalibrationNotices1764930000000, ApiTokens1764940000000, InstrumentIlluminant1765000000000, ReadingCluster1765010000000, PrintBatches1765010001000, CaseInsensitiveCodes1765030000000];

/**
 * The one data source: better-sqlite3, WAL, foreign keys on (TypeORM's driver sets
 * `foreign_keys = ON`), 5 s busy timeout. Migrations only; never `synchronize`.
 */
export function createDataSource(databaseFile: string): DataSource {
  return new DataSource({
    type: 'better-sqlite3',
    database: databaseFile,
    enableWAL: true,
    timeout: 5000,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsRun: false,
    synchronize: false,
    logging: ['error'],
    prepareDatabase: (db: { pragma(s: string): unknown }) => {
      db.pragma('synchronous = NORMAL'); // safe with WAL (SQLite docs, "WAL mode": durable except on power loss of the last commit)
    },
  });
}

/** Opens the database file and brings its schema up to date. */
export async function openDatabase(databaseFile: string): Promise<DataSource> {
  const ds = createDataSource(databaseFile);
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  return ds;
}
