import { Column, CreateDateColumn, Entity, ManyToOne, PrimaryGeneratedColumn, RelationId } from 'typeorm';
import { photoImageUrl, photoThumbUrl, type PhotoDto } from '../../shared/api/photo-answers.js';
import { User } from '../auth/user.entity.js';

/** An uploaded photo; its files live under `<dataDir>/photos/` by content hash (photo-files.ts). */
@Entity('photo')
export class Photo {
  @PrimaryGeneratedColumn('increment') id: number;
  /** SHA-256 of the uploaded bytes: the same file uploaded again is the same photo. */
  @Column('varchar', { length: 64, unique: true }) sha256: string;
  /** Media type sniffed from the bytes. */
  @Column('varchar', { length: 40 }) mime: string;
  /** Upright size, EXIF orientation applied. */
  @Column('integer') width: number;
  @Column('integer') height: number;
  /** The embedded ICC profile's description, or "none". */
  @Column('varchar', { length: 120 }) sourceProfile: string;
  /** EXIF DateTimeOriginal as ISO 8601 local time (with the EXIF offset when present). */
  @Column('varchar', { length: 32, nullable: true }) capturedAt: string | null;
  /** EXIF orientation of the original, 1–8. */
  @Column('integer') orientation: number;
  @Column('integer') byteSize: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) uploadedBy: User;
  @RelationId((p: Photo) => p.uploadedBy) uploadedById: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** The API shape of a photo. */
export function toPhotoDto(p: Photo): PhotoDto {
  return {
    id: p.id,
    width: p.width,
    height: p.height,
    sha256: p.sha256,
    sourceProfile: p.sourceProfile,
    mime: p.mime,
    capturedAt: p.capturedAt,
    orientation: p.orientation,
    byteSize: p.byteSize,
    uploadedById: p.uploadedById,
    createdAt: p.createdAt.toISOString(),
    imageUrl: photoImageUrl(p.id),
    thumbUrl: photoThumbUrl(p.id),
  };
}
